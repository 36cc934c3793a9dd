import { describe, expect, it } from 'vitest'
import { cathodeResistorFor } from '../../../shared/utils/bench/index'
import { inUnit } from './oracle'

describe('cathodeResistorFor', () => {
  it('EL84 pair, shared 130 Ω, 2×36 mA plate + 2×4 mA screen: Vk 10.4 V, 0.83 W', () => {
    // Source: BENCH-MATH EL84 check value (Philips EL84 data, recalled from memory).
    // By hand: Ik = 36 + 4 = 40 mA a tube, 80 mA for two; Vk = 130 × 0.080 = 10.4 V;
    // R = 10.4 / 0.080 = 130 Ω; P = 10.4² / 130 = 108.16 / 130 = 0.832 W; rating ≥ 2 × 0.832 = 1.664 W
    const sizing = cathodeResistorFor(10.4, 0.040, 2)
    expect(sizing.ohms).toBeCloseTo(130, 9)
    expect(sizing.watts).toBeCloseTo(0.832, 9)
    // common practice, no source (rating at twice the dissipation)
    expect(sizing.minRatingWatts).toBeCloseTo(1.664, 9)
  })

  it('a 12AX7 section at −2 V and 1.2 mA: 1667 Ω, 2.4 mW', () => {
    // Source: SOURCES.md, 12AX7 250 V, −2 V, 1.2 mA (S1). By hand: R = 2 / 0.0012 = 1666.67 Ω;
    // P = 2² / 1666.67 = 0.0024 W; rating ≥ 0.0048 W
    const sizing = cathodeResistorFor(2, 0.0012, 1)
    expect(sizing.ohms).toBeCloseTo(1666.667, 3)
    expect(sizing.watts).toBeCloseTo(0.0024, 12)
    expect(sizing.minRatingWatts).toBeCloseTo(0.0048, 12)
  })

  it('one tube alone needs twice the resistance of two sharing', () => {
    // Source: hand calculation, Ohm's law: 10 / 0.05 = 200 Ω; 10 / (2 × 0.05) = 100 Ω
    expect(cathodeResistorFor(10, 0.05, 1).ohms).toBeCloseTo(200, 9)
    expect(cathodeResistorFor(10, 0.05, 2).ohms).toBeCloseTo(100, 9)
  })

  it('agrees with the units oracle', () => {
    // Source: mathjs oracle: R = Vk / (n·Ik), P = Vk·(n·Ik)
    const sizing = cathodeResistorFor(28.3, 0.042879, 2)
    expect(sizing.ohms).toBeCloseTo(inUnit('28.3 V / (2 * 42.879 mA)', 'ohm'), 9)
    expect(sizing.watts).toBeCloseTo(inUnit('28.3 V * 2 * 42.879 mA', 'W'), 9)
  })

  it('rejects impossible inputs, naming them', () => {
    expect(() => cathodeResistorFor(0, 0.04, 2)).toThrow(new RangeError('cathodeVolts must be a positive number'))
    expect(() => cathodeResistorFor(10, -0.04, 2)).toThrow(/cathodeAmpsPerTube/)
    expect(() => cathodeResistorFor(10, 0.04, 0)).toThrow(/tubesSharing/)
    expect(() => cathodeResistorFor(10, 0.04, 2.5)).toThrow(/tubesSharing/)
  })
})
