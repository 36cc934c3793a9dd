import { describe, expect, it } from 'vitest'
import { cleanPowerFromPeakToPeak, peakToPeakToRms, powerRatioDb, rmsPower } from '../../../shared/utils/bench/index'
import { inUnit, sampledSinePower, sampledSineRms } from './oracle'

describe('peakToPeakToRms', () => {
  it('29.93 Vpp is 10.58 Vrms and 56.57 Vpp is 20.0 Vrms', () => {
    // Source: BENCH-MATH check values (sine RMS). By hand: 2√2 = 2.82843; 29.93 / 2.82843 = 10.582; 56.57 / 2.82843 = 20.001
    expect(peakToPeakToRms(29.93)).toBeCloseTo(10.582, 3)
    expect(peakToPeakToRms(56.57)).toBeCloseTo(20.001, 3)
  })

  it('agrees with the RMS of a sampled sine, √(mean(v²))', () => {
    // Source: mathjs oracle, RMS from its definition over one sampled period
    for (const vpp of [1, 29.93, 56.57, 848.5]) expect(peakToPeakToRms(vpp)).toBeCloseTo(sampledSineRms(vpp), 9)
  })
})

describe('rmsPower', () => {
  it('20 Vrms into 8 Ω is 50 W; 10.58 Vrms is 14 W', () => {
    // Source: BENCH-MATH check values. By hand: 20² / 8 = 400 / 8 = 50; 10.58² / 8 = 111.94 / 8 = 13.992
    expect(rmsPower(20, 8)).toBe(50)
    expect(rmsPower(10.58, 8)).toBeCloseTo(13.992, 3)
  })

  it('a 220 kΩ bleeder at 450 V d.c. dissipates about 0.92 W', () => {
    // Source: SOURCES.md, bleeder example. By hand: 450² / 220 000 = 202 500 / 220 000 = 0.9205 W
    expect(rmsPower(450, 220_000)).toBeCloseTo(0.9205, 4)
  })

  it('agrees with the units oracle', () => {
    // Source: mathjs oracle with units, P = V² / R in W
    expect(rmsPower(20, 8)).toBeCloseTo(inUnit('(20 V)^2 / (8 ohm)', 'W'), 12)
    expect(rmsPower(450, 220_000)).toBeCloseTo(inUnit('(450 V)^2 / (220 kohm)', 'W'), 12)
  })
})

describe('cleanPowerFromPeakToPeak', () => {
  it('14 W into 8 Ω is 29.93 Vpp; 50 W into 8 Ω is 56.57 Vpp', () => {
    // Source: BENCH-MATH check values. By hand: P = (Vpp / 2√2)² / R = Vpp² / (8·R);
    // 29.93² = 895.80, / 64 = 13.997 W; 56.57² = 3200.16, / 64 = 50.003 W
    expect(cleanPowerFromPeakToPeak(29.93, 8)).toBeCloseTo(13.997, 3)
    expect(cleanPowerFromPeakToPeak(56.57, 8)).toBeCloseTo(50.003, 3)
  })

  it('the 6V6GTA pair\'s 14 W and the 6L6GC pair\'s 55 W into 8 Ω', () => {
    // Source: SOURCES.md worked operating points (6V6GTA 14 W, S2; 6L6GC 55 W, S1).
    // By hand: Vrms = √(P·R): √112 = 10.583, √440 = 20.976; Vpp = 2√2·Vrms = 29.933 and 59.330
    expect(cleanPowerFromPeakToPeak(29.933, 8)).toBeCloseTo(14, 2)
    expect(cleanPowerFromPeakToPeak(59.330, 8)).toBeCloseTo(55, 2)
  })

  it('agrees with the mean power of a sampled sine', () => {
    // Source: mathjs oracle, P = mean(v²/R) over one sampled period
    for (const [vpp, ohms] of [[29.93, 8], [38.4, 4], [33.2, 16]] as const) {
      expect(cleanPowerFromPeakToPeak(vpp, ohms)).toBeCloseTo(sampledSinePower(vpp, ohms), 9)
    }
  })
})

describe('powerRatioDb', () => {
  it('a doubling is 3.01 dB, ten times is 10 dB, half is −3.01 dB', () => {
    // Source: definition of the bel (IEC 60027-3): 10·log10(2) = 3.0103
    expect(powerRatioDb(2, 1)).toBeCloseTo(3.0103, 4)
    expect(powerRatioDb(100, 10)).toBeCloseTo(10, 12)
    expect(powerRatioDb(1, 2)).toBeCloseTo(-3.0103, 4)
  })

  it('the 6L6GC pair\'s 55 W over the 6V6GTA pair\'s 14 W is 5.94 dB', () => {
    // Source: SOURCES.md operating points (55 W, S1; 14 W, S2). By hand: 55 / 14 = 3.92857;
    // log10(3.92857) = 0.59423; × 10 = 5.9423 dB
    expect(powerRatioDb(55, 14)).toBeCloseTo(5.9423, 4)
  })

  it('38.4 Vpp over 33.2 Vpp into the same load is 1.264 dB', () => {
    // Source: hand calculation. Power goes as V²: 20·log10(38.4 / 33.2) = 20·log10(1.156627) = 20 × 0.063194 = 1.2639 dB
    expect(powerRatioDb(cleanPowerFromPeakToPeak(38.4, 8), cleanPowerFromPeakToPeak(33.2, 8))).toBeCloseTo(1.2639, 4)
  })

  it('rejects impossible inputs, naming them', () => {
    expect(() => peakToPeakToRms(0)).toThrow(new RangeError('vpp must be a positive number'))
    expect(() => peakToPeakToRms(Number.NaN)).toThrow(RangeError)
    expect(() => rmsPower(10, 0)).toThrow(/loadOhms/)
    expect(() => rmsPower(10, -8)).toThrow(/loadOhms/)
    expect(() => rmsPower(Number.POSITIVE_INFINITY, 8)).toThrow(/vrms/)
    expect(() => cleanPowerFromPeakToPeak(30, Number.NaN)).toThrow(/loadOhms/)
    expect(() => powerRatioDb(0, 1)).toThrow(/p2/)
    expect(() => powerRatioDb(1, -1)).toThrow(/p1/)
  })
})
