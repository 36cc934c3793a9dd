import { describe, expect, it } from 'vitest'
import {
  cathodeCurrentPerTube,
  currentFromPrimaryDrop,
  currentFromSenseResistor,
  plateCurrentFromCathode,
} from '../../../shared/utils/bench/index'
import { inUnit } from './oracle'

describe('currentFromSenseResistor', () => {
  it('the 6V6GTA pair\'s 70 mA is 35 mA a tube: 35 mV across 1 Ω', () => {
    // Source: SOURCES.md, 6V6GTA 285 V, 70 mA zero-signal for the pair (S2). By hand: 70 / 2 = 35 mA; 0.035 V / 1 Ω = 35 mA
    expect(currentFromSenseResistor(0.035, 1)).toBeCloseTo(0.035, 12)
  })

  it('a sense resistor measured at 0.98 Ω: 35.2 mV reads 35.92 mA', () => {
    // Source: hand calculation, Ohm's law: 35.2 / 0.98 = 35.918 mA
    expect(currentFromSenseResistor(0.0352, 0.98)).toBeCloseTo(0.035918, 6)
  })

  it('agrees with the units oracle for the 6550A pair\'s 75 mA a tube across 10 Ω', () => {
    // Source: SOURCES.md, 6550A 450 V, 150 mA zero-signal for the pair (S2); mathjs oracle, I = V / R
    expect(currentFromSenseResistor(0.75, 10)).toBeCloseTo(inUnit('750 mV / 10 ohm', 'A'), 12)
    expect(currentFromSenseResistor(0.75, 10)).toBeCloseTo(0.075, 12)
  })
})

describe('currentFromPrimaryDrop', () => {
  it('1.59 V across a 41 Ω half primary is 38.8 mA', () => {
    // Source: BENCH-MATH transformer-resistance check value (common practice, no source).
    // By hand: 1.59 / 41 = 0.038780 A
    expect(currentFromPrimaryDrop(1.59, 41)).toBeCloseTo(0.038780, 6)
  })

  it('the 6550A\'s 75 mA a tube drops 2.25 V across a 30 Ω half primary', () => {
    // Source: SOURCES.md, 6550A 150 mA for the pair (S2); the 30 Ω winding is an invented example.
    // By hand: 2.25 / 30 = 0.075 A
    expect(currentFromPrimaryDrop(2.25, 30)).toBeCloseTo(0.075, 12)
  })

  it('agrees with the units oracle', () => {
    // Source: mathjs oracle, I = V / R
    expect(currentFromPrimaryDrop(1.59, 41)).toBeCloseTo(inUnit('1.59 V / 41 ohm', 'A'), 12)
  })
})

describe('cathodeCurrentPerTube', () => {
  it('an EL84 pair on a shared 130 Ω at 10.4 V draws 40 mA each (80 mA for one tube alone)', () => {
    // Source: BENCH-MATH EL84 check value (Philips EL84 data, recalled from memory).
    // By hand: 10.4 V / 130 Ω = 80 mA through the resistor; / 2 tubes = 40 mA
    expect(cathodeCurrentPerTube(10.4, 130, 2)).toBeCloseTo(0.040, 12)
    expect(cathodeCurrentPerTube(10.4, 130, 1)).toBeCloseTo(0.080, 12)
  })

  it('a 12AX7 section biased at −2 V and 1.2 mA: 2 V across 1667 Ω', () => {
    // Source: SOURCES.md, 12AX7 250 V, −2 V, 1.2 mA (S1, Sylvania via the encyclopedia).
    // By hand: R = 2 / 0.0012 = 1666.7 Ω; 2 V / 1666.7 Ω = 1.2 mA
    expect(cathodeCurrentPerTube(2, 2 / 0.0012, 1)).toBeCloseTo(0.0012, 12)
  })

  it('agrees with the units oracle for four tubes sharing one resistor', () => {
    // Source: mathjs oracle, I = V / R shared four ways
    expect(cathodeCurrentPerTube(28.3, 100, 4)).toBeCloseTo(inUnit('28.3 V / 100 ohm / 4', 'A'), 12)
  })
})

describe('plateCurrentFromCathode', () => {
  it('an EL84\'s 40 mA cathode current with 4 mA of screen leaves 36 mA for the plate', () => {
    // Source: BENCH-MATH EL84 check value (36 mA plate + 4 mA screen; Philips, recalled from memory);
    // Kirchhoff's current law: 4 / 40 = 0.1 screen share; 40 × (1 − 0.1) = 36 mA
    expect(plateCurrentFromCathode(0.040, 0.1)).toBeCloseTo(0.036, 12)
  })

  it('with no screen share the plate takes it all', () => {
    // Source: Kirchhoff's current law (cathode = plate + screen)
    expect(plateCurrentFromCathode(0.040, 0)).toBe(0.040)
  })

  it('agrees with the units oracle at the default 5 % screen share', () => {
    // Source: mathjs oracle; the 5 % default share is common practice, no source
    expect(plateCurrentFromCathode(0.0625, 0.05)).toBeCloseTo(inUnit('62.5 mA - 5 / 100 * 62.5 mA', 'A'), 12)
  })

  it('rejects impossible inputs, naming them', () => {
    expect(() => currentFromSenseResistor(0.035, 0)).toThrow(new RangeError('ohms must be a positive number'))
    expect(() => currentFromSenseResistor(-0.035, 1)).toThrow(/volts/)
    expect(() => currentFromPrimaryDrop(1.5, Number.NaN)).toThrow(/halfPrimaryOhms/)
    expect(() => currentFromPrimaryDrop(0, 41)).toThrow(/volts/)
    expect(() => cathodeCurrentPerTube(10, 130, 0)).toThrow(/tubesSharing/)
    expect(() => cathodeCurrentPerTube(10, 130, 1.5)).toThrow(/tubesSharing/)
    expect(() => cathodeCurrentPerTube(10, 0, 2)).toThrow(/cathodeOhms/)
    expect(() => cathodeCurrentPerTube(Number.POSITIVE_INFINITY, 130, 2)).toThrow(/cathodeVolts/)
    expect(() => plateCurrentFromCathode(0.04, -0.01)).toThrow(/screenFraction/)
    expect(() => plateCurrentFromCathode(0.04, 1)).toThrow(/screenFraction/)
    expect(() => plateCurrentFromCathode(0, 0.05)).toThrow(/cathodeAmps/)
  })
})
