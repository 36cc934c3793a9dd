import { describe, expect, it } from 'vitest'
import { biasSupplyRange } from '../../../shared/utils/bench/index'
import { inUnit, sampledPeakForRms } from './oracle'

const divider = { topOhms: 10_000, potOhms: 25_000, bottomOhms: 15_000 }

describe('biasSupplyRange', () => {
  it('50 Vrms tap with a 0.7 V diode peaks at −70.0 V unloaded', () => {
    // Source: BENCH-MATH check value (half-wave peak). By hand: 50 × √2 = 70.711; − 0.7 = 70.011 → −70.011 V
    const range = biasSupplyRange({ tapVoltsRms: 50, diodeDropVolts: 0.7, ...divider })
    expect(range.dcVolts).toBeCloseTo(-70.011, 3)
  })

  it('10 k / 25 k pot / 15 k spans −21.0 V to −56.0 V: the 6L6GC\'s −37 V fits, the 6V6GTA\'s −19 V does not', () => {
    // Source: voltage divider rule, by hand: total 50 kΩ; least negative −70.011 × 15 / 50 = −21.003 V;
    // most negative −70.011 × 40 / 50 = −56.009 V. Grid volts from SOURCES.md: 6L6GC −37 V (S1), 6V6GTA −19 V (S2).
    const range = biasSupplyRange({ tapVoltsRms: 50, diodeDropVolts: 0.7, ...divider })
    expect(range.leastNegativeVolts).toBeCloseTo(-21.003, 3)
    expect(range.mostNegativeVolts).toBeCloseTo(-56.009, 3)
    expect(-37).toBeLessThan(range.leastNegativeVolts)
    expect(-37).toBeGreaterThan(range.mostNegativeVolts)
    expect(-19).toBeGreaterThan(range.leastNegativeVolts)
  })

  it('with no top resistor the most negative end is the rail itself', () => {
    // Source: voltage divider rule; by hand 50 × √2 = 70.711 V with no diode drop
    const range = biasSupplyRange({ tapVoltsRms: 50, diodeDropVolts: 0, topOhms: 0, potOhms: 10_000, bottomOhms: 10_000 })
    expect(range.mostNegativeVolts).toBeCloseTo(-70.711, 3)
    expect(range.leastNegativeVolts).toBeCloseTo(-35.355, 3)
  })

  it('agrees with a sampled sine\'s peak and a divider worked in units', () => {
    // Source: mathjs oracle: the peak of a sine whose sampled RMS is the tap voltage; I = V / ΣR through the divider
    const tap = 36
    const range = biasSupplyRange({ tapVoltsRms: tap, diodeDropVolts: 0.6, topOhms: 4700, potOhms: 10_000, bottomOhms: 22_000 })
    const rail = sampledPeakForRms(tap) - 0.6
    expect(range.dcVolts).toBeCloseTo(-rail, 9)
    expect(range.leastNegativeVolts).toBeCloseTo(-inUnit(`${rail} V / (4.7 kohm + 10 kohm + 22 kohm) * 22 kohm`, 'V'), 9)
    expect(range.mostNegativeVolts).toBeCloseTo(-inUnit(`${rail} V / (4.7 kohm + 10 kohm + 22 kohm) * 32 kohm`, 'V'), 9)
  })

  it('rejects impossible inputs, naming them', () => {
    const ok = { tapVoltsRms: 50, diodeDropVolts: 0.7, ...divider }
    expect(() => biasSupplyRange({ ...ok, tapVoltsRms: 0 })).toThrow(new RangeError('tapVoltsRms must be a positive number'))
    expect(() => biasSupplyRange({ ...ok, diodeDropVolts: -0.7 })).toThrow(/diodeDropVolts/)
    expect(() => biasSupplyRange({ ...ok, tapVoltsRms: 0.4 })).toThrow(/diodeDropVolts/)
    expect(() => biasSupplyRange({ ...ok, topOhms: -1 })).toThrow(/topOhms/)
    expect(() => biasSupplyRange({ ...ok, potOhms: 0 })).toThrow(/potOhms/)
    expect(() => biasSupplyRange({ ...ok, bottomOhms: Number.NaN })).toThrow(/bottomOhms/)
  })
})
