import { describe, expect, it } from 'vitest'
import { reflectedImpedance, turnsRatioForImpedances } from '../../../shared/utils/bench/index'
import { idealTransformerPrimaryOhms, ratio } from './oracle'

describe('turnsRatioForImpedances', () => {
  it('8 kΩ to 8 Ω is a 31.62 turns ratio', () => {
    // Source: BENCH-MATH check value (reflected impedance law). By hand: √(8000 / 8) = √1000 = 31.623
    expect(turnsRatioForImpedances(8000, 8)).toBeCloseTo(31.623, 3)
  })

  it('the 6L6GC pair\'s 5.6 kΩ plate to plate onto 8 Ω: 26.46; the 6V6GTA pair\'s 8 kΩ onto 4 Ω: 44.72', () => {
    // Source: SOURCES.md operating points (6L6GC 5.6 kΩ, S1; 6V6GTA 8 kΩ, S2).
    // By hand: √(5600 / 8) = √700 = 26.458; √(8000 / 4) = √2000 = 44.721
    expect(turnsRatioForImpedances(5600, 8)).toBeCloseTo(26.458, 3)
    expect(turnsRatioForImpedances(8000, 4)).toBeCloseTo(44.721, 3)
  })

  it('gives a ratio through which an ideal transformer shows the primary impedance asked for', () => {
    // Source: mathjs oracle: ideal transformer, Vp = n·Vs and Ip = Is / n, so Zp = Vp / Ip
    for (const [zp, zs] of [[5600, 8], [8000, 16], [1900, 4]] as const) {
      expect(idealTransformerPrimaryOhms(zs, turnsRatioForImpedances(zp, zs))).toBeCloseTo(zp, 6)
    }
  })
})

describe('reflectedImpedance', () => {
  it('16 Ω on the 8 Ω tap of an 8 kΩ transformer reflects 16 kΩ', () => {
    // Source: BENCH-MATH check value. By hand: 16 × 31.623² = 16 × 1000 = 16 000 Ω
    expect(reflectedImpedance(16, Math.sqrt(1000))).toBeCloseTo(16_000, 6)
  })

  it('a 4 Ω speaker on the 6L6GC pair\'s 8 Ω tap reflects 2.8 kΩ, half the 5.6 kΩ load', () => {
    // Source: SOURCES.md, 6L6GC 5.6 kΩ plate to plate (S1). By hand: n² = 5600 / 8 = 700; 4 × 700 = 2800 Ω
    expect(reflectedImpedance(4, Math.sqrt(700))).toBeCloseTo(2800, 6)
  })

  it('agrees with an ideal transformer followed volt by volt', () => {
    // Source: mathjs oracle (units): Zp = Vp / Ip
    for (const [zs, n] of [[8, 31.623], [16, 26.458], [4, 10]] as const) {
      expect(reflectedImpedance(zs, n)).toBeCloseTo(idealTransformerPrimaryOhms(zs, n), 6)
    }
    expect(reflectedImpedance(8, 10)).toBeCloseTo(ratio('8 ohm * 10^2 / 1 ohm'), 9)
  })

  it('rejects impossible inputs, naming them', () => {
    expect(() => turnsRatioForImpedances(0, 8)).toThrow(new RangeError('primaryOhms must be a positive number'))
    expect(() => turnsRatioForImpedances(8000, Number.NaN)).toThrow(/secondaryOhms/)
    expect(() => reflectedImpedance(-8, 31.6)).toThrow(/secondaryOhms/)
    expect(() => reflectedImpedance(8, 0)).toThrow(/turnsRatio/)
  })
})
