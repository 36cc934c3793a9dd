import { describe, expect, it } from 'vitest'
import { reflectedImpedance, turnsRatioForImpedances } from '../../../shared/utils/bench/index'

describe('load reflection', () => {
  it('8 kΩ to 8 Ω is a 31.62 turns ratio; 16 Ω on that tap reflects 16 kΩ', () => {
    // Source: reflected impedance law
    const n = turnsRatioForImpedances(8000, 8)
    expect(n).toBeCloseTo(31.62, 2)
    // Source: reflected impedance law
    expect(reflectedImpedance(16, n)).toBeCloseTo(16_000, 6)
    expect(reflectedImpedance(8, n)).toBeCloseTo(8000, 6)
  })

  it('rejects impossible inputs, naming them', () => {
    expect(() => turnsRatioForImpedances(0, 8)).toThrow(new RangeError('primaryOhms must be a positive number'))
    expect(() => turnsRatioForImpedances(8000, Number.NaN)).toThrow(/secondaryOhms/)
    expect(() => reflectedImpedance(-8, 31.6)).toThrow(/secondaryOhms/)
    expect(() => reflectedImpedance(8, 0)).toThrow(/turnsRatio/)
  })
})
