import { describe, expect, it } from 'vitest'
import { cathodeResistorFor } from '../../../shared/utils/bench/index'

describe('cathode resistor sizing', () => {
  it('EL84 pair, shared 130 Ω, 2×36 mA plate + 2×4 mA screen: Vk 10.4 V, 0.83 W', () => {
    // Source: Philips EL84 data (recalled from memory)
    const vk = 130 * (2 * 0.036 + 2 * 0.004)
    expect(vk).toBeCloseTo(10.4, 9)
    const sizing = cathodeResistorFor(vk, 0.036 + 0.004, 2)
    expect(sizing.ohms).toBeCloseTo(130, 9)
    expect(sizing.watts).toBeCloseTo(0.83, 2)
  })

  it('asks for a part rated at twice the dissipation', () => {
    // common practice, no source
    const sizing = cathodeResistorFor(10.4, 0.040, 2)
    expect(sizing.minRatingWatts).toBeCloseTo(2 * sizing.watts, 12)
  })

  it('one tube alone needs twice the resistance of two sharing', () => {
    // Source: Ohm's law
    expect(cathodeResistorFor(10, 0.05, 1).ohms).toBeCloseTo(200, 9)
    expect(cathodeResistorFor(10, 0.05, 2).ohms).toBeCloseTo(100, 9)
  })

  it('rejects impossible inputs, naming them', () => {
    expect(() => cathodeResistorFor(0, 0.04, 2)).toThrow(new RangeError('cathodeVolts must be a positive number'))
    expect(() => cathodeResistorFor(10, -0.04, 2)).toThrow(/cathodeAmpsPerTube/)
    expect(() => cathodeResistorFor(10, 0.04, 0)).toThrow(/tubesSharing/)
    expect(() => cathodeResistorFor(10, 0.04, 2.5)).toThrow(/tubesSharing/)
  })
})
