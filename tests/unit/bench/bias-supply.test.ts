import { describe, expect, it } from 'vitest'
import { biasSupplyRange } from '../../../shared/utils/bench/index'

const divider = { topOhms: 10_000, potOhms: 25_000, bottomOhms: 15_000 }

describe('bias supply range', () => {
  it('50 Vrms tap with a 0.7 V diode peaks at −70.0 V unloaded', () => {
    // Source: half-wave peak
    const range = biasSupplyRange({ tapVoltsRms: 50, diodeDropVolts: 0.7, ...divider })
    expect(range.dcVolts).toBeCloseTo(-70.0, 1)
  })

  it('the wiper spans bottom/total to (bottom + pot)/total of the rail', () => {
    // Source: voltage divider rule
    const range = biasSupplyRange({ tapVoltsRms: 50, diodeDropVolts: 0.7, ...divider })
    expect(range.leastNegativeVolts).toBeCloseTo(range.dcVolts * 15 / 50, 12)
    expect(range.mostNegativeVolts).toBeCloseTo(range.dcVolts * 40 / 50, 12)
    expect(range.mostNegativeVolts).toBeLessThan(range.leastNegativeVolts)
    expect(range.leastNegativeVolts).toBeLessThan(0)
  })

  it('with no top resistor the most negative end is the rail itself', () => {
    // Source: voltage divider rule
    const range = biasSupplyRange({ tapVoltsRms: 50, diodeDropVolts: 0, topOhms: 0, potOhms: 10_000, bottomOhms: 10_000 })
    expect(range.mostNegativeVolts).toBeCloseTo(-50 * Math.SQRT2, 12)
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
