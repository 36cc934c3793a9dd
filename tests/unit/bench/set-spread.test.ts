import { all, create } from 'mathjs'
import { describe, expect, it } from 'vitest'
import { setMeanAmps, setSpread, sortIntoSets, spreadAgrees, withinTolerance } from '../../../shared/utils/bench/index'

// Exact fractions: an oracle that shares no arithmetic with the engine.
const math = create(all!, { number: 'Fraction' })

describe('setSpread and setMeanAmps', () => {
  it('a pair at 40 and 42 mA spreads 5 %, with a mean of 41 mA', () => {
    // Source: BENCH-MATH, a set is matched when its largest reading is at most (1 + tolerance) times its smallest.
    // By hand: 42 / 40 − 1 = 0.05; (40 + 42) / 2 = 41
    expect(setSpread([0.040, 0.042])).toBeCloseTo(0.05, 12)
    expect(setMeanAmps([0.040, 0.042])).toBeCloseTo(0.041, 12)
    expect(spreadAgrees(0.05, [0.042, 0.040])).toBe(true)
  })

  it('matches the demo quad against exact fractions', () => {
    // Source: mathjs oracle, fractions (no floating point): 42.5 / 41.2 − 1 and the mean of four
    const uA = [41_200, 41_800, 42_100, 42_500]
    const exact = math.subtract(math.divide(math.fraction(42_500), math.fraction(41_200)), 1)
    expect(setSpread(uA.map(u => u / 1e6))).toBeCloseTo(Number(math.number(exact as never)), 12)
    const mean = math.divide(math.add(...uA.map(u => math.fraction(u)) as [never, never]), 4)
    expect(setMeanAmps(uA.map(u => u / 1e6)) * 1e6).toBeCloseTo(Number(math.number(mean as never)), 6)
    expect(spreadAgrees(Number(math.number(exact as never)), uA.map(u => u / 1e6))).toBe(true)
  })

  it('reads a set as the Tube sorter matched it: every sorted set is within its tolerance by this spread', () => {
    // Source: definition of a matched set (largest ≤ (1 + tolerance) · smallest), the sorter's own rule
    const readings = [38.9, 41.2, 41.8, 42.1, 42.5, 45.2].map((mA, i) => ({ id: `T${i}`, amps: mA / 1000 }))
    const { sets } = sortIntoSets(readings, 2, 0.02)
    expect(sets.length).toBeGreaterThan(0)
    for (const s of sets) {
      const amps = s.ids.map(id => readings.find(r => r.id === id)!.amps)
      expect(setSpread(amps)).toBeCloseTo(s.spreadFraction, 12)
      expect(withinTolerance(Math.min(...amps), Math.max(...amps), setSpread(amps))).toBe(true)
    }
  })

  it('refuses fewer than two readings and non-positive ones, naming the input', () => {
    expect(() => setSpread([0.04])).toThrow(/amps must list at least two/)
    expect(() => setSpread([0.04, 0])).toThrow(/amps\[1\] must be a positive number/)
    expect(() => setMeanAmps([])).toThrow(RangeError)
  })

  it('agrees with a stored spread only when the readings give it', () => {
    // Source: SOURCES.md, 6550A 150 mA for the pair (S2): 75 / 75 − 1 = 0; by hand 42 / 40 − 1 = 0.05
    expect(spreadAgrees(0, [0.075, 0.075])).toBe(true)
    expect(spreadAgrees(0.05, [0.040, 0.042])).toBe(true)
    expect(spreadAgrees(0.02, [0.040, 0.042])).toBe(false)
  })
})
