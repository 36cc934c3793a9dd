import { describe, expect, it } from 'vitest'
import { cleanPowerFromPeakToPeak, peakToPeakToRms, powerRatioDb, rmsPower } from '../../../shared/utils/bench/index'

describe('clean power', () => {
  it('14 W into 8 Ω is 10.58 Vrms, 29.93 Vpp', () => {
    // Source: Ohm's law / sine RMS
    expect(rmsPower(10.58, 8)).toBeCloseTo(14, 1)
    expect(peakToPeakToRms(29.93)).toBeCloseTo(10.58, 2)
    expect(cleanPowerFromPeakToPeak(29.93, 8)).toBeCloseTo(14, 2)
  })

  it('50 W into 8 Ω is 20.0 Vrms, 56.57 Vpp', () => {
    // Source: Ohm's law / sine RMS
    expect(rmsPower(20, 8)).toBe(50)
    expect(peakToPeakToRms(56.57)).toBeCloseTo(20.0, 2)
    expect(cleanPowerFromPeakToPeak(56.57, 8)).toBeCloseTo(50, 1)
  })

  it('38.4 Vpp and 33.2 Vpp into 8 Ω are about 23 W and 17 W, about 6 W apart', () => {
    // common practice, no source
    const high = cleanPowerFromPeakToPeak(38.4, 8)
    const low = cleanPowerFromPeakToPeak(33.2, 8)
    expect(Math.round(high)).toBe(23)
    expect(Math.round(low)).toBe(17)
    expect(Math.round(high - low)).toBe(6)
  })

  it('peak-to-peak is 2√2 times RMS for a sine', () => {
    // Source: Ohm's law / sine RMS
    expect(peakToPeakToRms(2 * Math.SQRT2)).toBeCloseTo(1, 12)
  })

  it('a doubling of power is about 3.01 dB, ten times is 10 dB', () => {
    // Source: definition of the decibel, 10·log10(P2/P1)
    expect(powerRatioDb(2, 1)).toBeCloseTo(3.0103, 4)
    expect(powerRatioDb(100, 10)).toBeCloseTo(10, 12)
    expect(powerRatioDb(1, 2)).toBeCloseTo(-3.0103, 4)
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
