import { describe, expect, it } from 'vitest'
import { exactlyWithin, highPassGain, idealTransformerPrimaryOhms, inUnit, integratedCapEnergy, ratio, sampledPeakForRms, sampledSinePower, sampledSineRms, solvedDischarge } from './oracle'

// The oracle itself, against textbook values, so a slip in it cannot pass a wrong engine.
describe('the mathjs oracle', () => {
  it('works in units', () => {
    // Source: SI prefixes: 35 mV / 1 Ω = 35 mA; 1 kΩ = 1000 Ω
    expect(inUnit('35 mV / 1 ohm', 'mA')).toBeCloseTo(35, 12)
    expect(ratio('8 kohm / 8 ohm')).toBeCloseTo(1000, 12)
  })

  it('gives a sine 0.7071 of its peak as RMS, and half the peak squared over R as power', () => {
    // Source: RMS of a sine is peak/√2 = 0.70711 × peak (any electrical engineering handbook)
    expect(sampledSineRms(2)).toBeCloseTo(0.707107, 6)
    expect(sampledPeakForRms(1)).toBeCloseTo(1.414214, 6)
    // Source: a 1 V peak sine into 1 Ω averages 0.5 W
    expect(sampledSinePower(2, 1)).toBeCloseTo(0.5, 9)
  })

  it('finds the RC high-pass 3 dB down where ωRC = 1, and V0/e after one time constant', () => {
    // Source: first-order high-pass: |H| = 1/√2 at ωRC = 1
    expect(highPassGain(1 / (2 * Math.PI), 1, 1)).toBeCloseTo(0.707107, 6)
    // Source: RC discharge: 36.79 % remains after one time constant
    expect(solvedDischarge(100, 1, 1, 1)).toBeCloseTo(36.788, 3)
  })

  it('integrates ½CV² and reflects Zs·n²', () => {
    // Source: 1 F at 1 V stores 0.5 J
    expect(integratedCapEnergy(1, 1)).toBeCloseTo(0.5, 9)
    // Source: ideal transformer, 8 Ω through a 10:1 ratio looks like 800 Ω
    expect(idealTransformerPrimaryOhms(8, 10)).toBeCloseTo(800, 9)
  })

  it('compares ratios exactly', () => {
    // Source: 42/40 = 1.05 exactly
    expect(exactlyWithin(40_000, 42_000, 5)).toBe(true)
    expect(exactlyWithin(40_000, 42_001, 5)).toBe(false)
  })
})
