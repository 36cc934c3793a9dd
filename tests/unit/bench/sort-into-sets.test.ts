import fc from 'fast-check'
import { describe, expect, it } from 'vitest'
import { sortIntoSets, withinTolerance } from '../../../shared/utils/bench/index'
import type { TubeReading } from '../../../shared/utils/bench/index'
import { exactlyWithin } from './oracle'

// Readings typed to a few digits land exactly on the tolerance edge; the match
// rule allows this much floating-point slack on the spread.
const SLACK = 1e-9
const spreadOf = (amps: number[]) => Math.max(...amps) / Math.min(...amps) - 1

/** Every way to pick disjoint sets of exactly setSize that meet the tolerance. */
function bruteForceBest(readings: TubeReading[], setSize: number, tolerance: number) {
  let bestSets = 0
  let bestSpread = 0
  const walk = (remaining: number[], sets: number, spread: number) => {
    if (sets > bestSets || (sets === bestSets && spread < bestSpread)) {
      bestSets = sets
      bestSpread = spread
    }
    if (remaining.length < setSize) return
    const [first, ...rest] = remaining as [number, ...number[]]
    walk(rest, sets, spread)
    const choose = (start: number, picked: number[]) => {
      if (picked.length === setSize) {
        const amps = picked.map(k => readings[k]!.amps)
        const s = spreadOf(amps)
        if (s <= tolerance + SLACK) walk(rest.filter(k => !picked.includes(k)), sets + 1, spread + s)
        return
      }
      for (let j = start; j < rest.length; j++) choose(j + 1, [...picked, rest[j]!])
    }
    choose(0, [first])
  }
  walk(readings.map((_, k) => k), 0, 0)
  return { sets: bestSets, spread: bestSpread }
}

describe('withinTolerance', () => {
  it('a pair at 40 and 42 mA is matched within 5 %, at 40 and 42.01 mA it is not', () => {
    // Source: BENCH-MATH, a set is matched when its largest reading is at most (1 + tolerance) times its smallest.
    // By hand: 42 / 40 = 1.05 exactly; 42.01 / 40 = 1.05025
    expect(withinTolerance(0.040, 0.042, 0.05)).toBe(true)
    expect(withinTolerance(0.040, 0.04201, 0.05)).toBe(false)
  })

  it('the 6550A pair\'s 75 mA each is a perfect match at any tolerance', () => {
    // Source: SOURCES.md, 6550A 150 mA for the pair (S2): 75 / 75 − 1 = 0
    expect(withinTolerance(0.075, 0.075, 0)).toBe(true)
  })

  it('agrees with exact rational arithmetic for readings in whole microamps', () => {
    // Source: mathjs oracle, fractions (no floating point)
    fc.assert(fc.property(
      fc.integer({ min: 20_000, max: 80_000 }),
      fc.integer({ min: 0, max: 8_000 }),
      fc.integer({ min: 0, max: 15 }),
      (small, extra, percent) => {
        const large = small + extra
        expect(withinTolerance(small / 1e6, large / 1e6, percent / 100)).toBe(exactlyWithin(small, large, percent))
      },
    ), { numRuns: 500 })
  })
})

describe('sortIntoSets', () => {
  it('pairs close readings and leaves the odd one out', () => {
    // Source: definition of a matched set (largest ≤ (1 + tolerance) · smallest)
    const result = sortIntoSets([
      { id: 'a', amps: 0.0300 },
      { id: 'b', amps: 0.0400 },
      { id: 'c', amps: 0.0305 },
      { id: 'd', amps: 0.0410 },
      { id: 'e', amps: 0.0500 },
    ], 2, 0.05)
    expect(result.sets.map(s => s.ids)).toEqual([['a', 'c'], ['b', 'd']])
    expect(result.unmatched).toEqual(['e'])
    // By hand: mean (30.0 + 30.5) / 2 = 30.25 mA; spread 30.5 / 30.0 − 1 = 0.016667
    expect(result.sets[0]!.meanAmps).toBeCloseTo(0.03025, 12)
    expect(result.sets[0]!.spreadFraction).toBeCloseTo(0.016667, 6)
  })

  it('prefers more sets over tighter ones', () => {
    // Source: definition of the sort (most sets first, then least total spread)
    // 30/31 alone is tightest, but 29/30 and 31/32 make two pairs.
    const result = sortIntoSets([
      { id: 'p', amps: 0.029 },
      { id: 'q', amps: 0.030 },
      { id: 'r', amps: 0.031 },
      { id: 's', amps: 0.032 },
    ], 2, 0.04)
    expect(result.sets.map(s => s.ids)).toEqual([['p', 'q'], ['r', 's']])
    expect(result.unmatched).toEqual([])
  })

  it('among equal counts, picks the least total spread', () => {
    // Source: definition of the sort (most sets first, then least total spread)
    const result = sortIntoSets([
      { id: 'a', amps: 0.030 },
      { id: 'b', amps: 0.0309 },
      { id: 'c', amps: 0.0310 },
    ], 2, 0.05)
    expect(result.sets.map(s => s.ids)).toEqual([['b', 'c']])
    expect(result.unmatched).toEqual(['a'])
  })

  it('counts a set exactly at the tolerance as matched', () => {
    // Source: definition of a matched set ("at most" 1 + tolerance)
    const result = sortIntoSets([{ id: 'x', amps: 0.040 }, { id: 'y', amps: 0.042 }], 2, 0.05)
    expect(result.sets).toHaveLength(1)
    const none = sortIntoSets([{ id: 'x', amps: 0.040 }, { id: 'y', amps: 0.04201 }], 2, 0.05)
    expect(none.sets).toHaveLength(0)
    expect(none.unmatched).toEqual(['x', 'y'])
  })

  it('sorts quads, ordered by mean', () => {
    // Source: definition of the sort (sets ordered by mean)
    const amps = [0.052, 0.031, 0.050, 0.030, 0.051, 0.032, 0.053, 0.0305]
    const result = sortIntoSets(amps.map((a, k) => ({ id: `t${k}`, amps: a })), 4, 0.1)
    expect(result.sets.map(s => s.ids)).toEqual([['t3', 't7', 't1', 't5'], ['t2', 't4', 't0', 't6']])
    expect(result.sets[0]!.meanAmps).toBeLessThan(result.sets[1]!.meanAmps)
  })

  it('returns nothing for no readings', () => {
    expect(sortIntoSets([], 2, 0.05)).toEqual({ sets: [], unmatched: [] })
  })

  it('rejects a bad set size, tolerance or reading', () => {
    const r = [{ id: 'a', amps: 0.03 }, { id: 'b', amps: 0.031 }]
    expect(() => sortIntoSets(r, 1, 0.05)).toThrow(new RangeError('setSize must be a whole number of at least 2'))
    expect(() => sortIntoSets(r, 2.5, 0.05)).toThrow(/setSize/)
    expect(() => sortIntoSets(r, Number.NaN, 0.05)).toThrow(/setSize/)
    expect(() => sortIntoSets(r, 2, -0.01)).toThrow(/tolerance/)
    expect(() => sortIntoSets(r, 2, Number.POSITIVE_INFINITY)).toThrow(/tolerance/)
    expect(() => sortIntoSets([{ id: 'a', amps: 0 }], 2, 0.05)).toThrow(/readings\[0\]\.amps/)
    expect(() => sortIntoSets([{ id: '', amps: 0.03 }], 2, 0.05)).toThrow(/readings\[0\]\.id/)
    expect(() => sortIntoSets([{ id: 'a', amps: 0.03 }, { id: 'a', amps: 0.031 }], 2, 0.05)).toThrow(/unique/)
  })

  it('property: each id once, every set within tolerance, as many sets as any grouping, least spread among those', () => {
    // Source: brute-force enumeration of every grouping (≤ 8 readings)
    const readings = fc
      .array(fc.integer({ min: 25, max: 45 }), { minLength: 0, maxLength: 8 })
      .map(ma => ma.map((m, k) => ({ id: `tube-${k}`, amps: m / 1000 })))
    const tolerance = fc.oneof(
      fc.constantFrom(0, 0.02, 0.05, 0.1),
      fc.double({ min: 0, max: 0.3, noNaN: true }),
    )
    fc.assert(
      fc.property(readings, fc.integer({ min: 2, max: 4 }), tolerance, (rs, setSize, tol) => {
        const result = sortIntoSets(rs, setSize, tol)
        const placed = [...result.sets.flatMap(s => s.ids), ...result.unmatched]
        expect(placed.slice().sort()).toEqual(rs.map(r => r.id).sort())
        expect(new Set(placed).size).toBe(placed.length)

        const byId = new Map(rs.map(r => [r.id, r.amps]))
        let total = 0
        let lastMean = -Infinity
        for (const set of result.sets) {
          const amps = set.ids.map(id => byId.get(id)!)
          expect(amps).toHaveLength(setSize)
          expect(spreadOf(amps)).toBeLessThanOrEqual(tol + SLACK)
          expect(set.spreadFraction).toBeCloseTo(spreadOf(amps), 12)
          expect(set.meanAmps).toBeCloseTo(amps.reduce((a, b) => a + b, 0) / amps.length, 12)
          expect(set.meanAmps).toBeGreaterThanOrEqual(lastMean)
          lastMean = set.meanAmps
          total += set.spreadFraction
        }

        const best = bruteForceBest(rs, setSize, tol)
        expect(result.sets.length).toBe(best.sets)
        expect(Math.abs(total - best.spread)).toBeLessThanOrEqual(1e-9)
      }),
      { numRuns: 400 },
    )
  })
})
