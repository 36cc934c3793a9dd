import { describe, expect, it } from 'vitest'
import {
  cathodeCurrentPerTube,
  currentFromPrimaryDrop,
  currentFromSenseResistor,
  idleCurrentForPercent,
  plateCurrentFromCathode,
} from '../../../shared/utils/bench/index'

describe('current from a measurement', () => {
  it('sense resistor: 35 mV across 1 Ω is 35 mA', () => {
    // Source: Ohm's law
    expect(currentFromSenseResistor(0.035, 1)).toBeCloseTo(0.035, 12)
    expect(currentFromSenseResistor(0.0352, 0.98)).toBeCloseTo(0.035918, 6)
  })

  it('transformer-resistance method: 41 Ω half primary, 450 V, 70 % of 25 W is 38.9 mA and 1.59 V', () => {
    // common practice, no source
    const amps = idleCurrentForPercent(450, 25, 70)
    expect(amps * 1000).toBeCloseTo(38.9, 1)
    const drop = amps * 41
    expect(drop).toBeCloseTo(1.59, 2)
    expect(currentFromPrimaryDrop(1.59, 41) * 1000).toBeCloseTo(38.8, 1)
    expect(currentFromPrimaryDrop(drop, 41)).toBeCloseTo(amps, 12)
  })

  it('EL84 pair on a shared 130 Ω at 10.4 V is 40 mA cathode current each', () => {
    // Source: Philips EL84 data (recalled from memory)
    expect(cathodeCurrentPerTube(10.4, 130, 2)).toBeCloseTo(0.040, 12)
    expect(cathodeCurrentPerTube(10.4, 130, 1)).toBeCloseTo(0.080, 12)
  })

  it('screen share comes off the cathode current', () => {
    // Source: Kirchhoff's current law (cathode current = plate + screen)
    expect(plateCurrentFromCathode(0.040, 0.1)).toBeCloseTo(0.036, 12)
    expect(plateCurrentFromCathode(0.040, 0)).toBe(0.040)
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
