import { describe, expect, it } from 'vitest'
import { capDrainSeconds, capEnergyJoules, capVoltageAfter, capacitanceForCorner, rcCornerHz } from '../../../shared/utils/bench/index'

describe('cap drain', () => {
  it('100 µF through 10 kΩ from 450 V to 50 V takes 2.20 s; 10.1 J stored at 450 V', () => {
    // Source: RC discharge law
    expect(capDrainSeconds(450, 50, 100e-6, 10_000)).toBeCloseTo(2.20, 2)
    // Source: RC discharge law
    expect(capEnergyJoules(100e-6, 450)).toBeCloseTo(10.1, 1)
  })

  it('after one time constant 36.8 % remains, and the drain time round-trips', () => {
    // Source: RC discharge law
    expect(capVoltageAfter(450, 1, 100e-6, 10_000)).toBeCloseTo(450 / Math.E, 9)
    expect(capVoltageAfter(450, 0, 100e-6, 10_000)).toBe(450)
    const t = capDrainSeconds(450, 50, 100e-6, 10_000)
    expect(capVoltageAfter(450, t, 100e-6, 10_000)).toBeCloseTo(50, 9)
  })

  it('rejects a target at or above the start, and other impossible inputs', () => {
    expect(() => capDrainSeconds(450, 450, 1e-4, 1e4)).toThrow(new RangeError('vTarget must be below v0'))
    expect(() => capDrainSeconds(450, 500, 1e-4, 1e4)).toThrow(/vTarget/)
    expect(() => capDrainSeconds(450, 0, 1e-4, 1e4)).toThrow(/vTarget/)
    expect(() => capDrainSeconds(450, 50, 0, 1e4)).toThrow(/farads/)
    expect(() => capDrainSeconds(450, 50, 1e-4, Number.NaN)).toThrow(/ohms/)
    expect(() => capVoltageAfter(450, -1, 1e-4, 1e4)).toThrow(/seconds/)
    expect(() => capVoltageAfter(Number.POSITIVE_INFINITY, 1, 1e-4, 1e4)).toThrow(/v0/)
    expect(() => capEnergyJoules(-1e-4, 450)).toThrow(/farads/)
    expect(() => capEnergyJoules(1e-4, -450)).toThrow(/volts/)
  })
})

describe('RC corner', () => {
  it('130 Ω with 25 µF has its corner at 48.97 Hz', () => {
    // Source: RC high-pass corner
    expect(rcCornerHz(130, 25e-6)).toBeCloseTo(48.97, 2)
    // Source: RC high-pass corner
    expect(capacitanceForCorner(130, 48.97)).toBeCloseTo(25e-6, 9)
  })

  it('rejects impossible inputs, naming them', () => {
    expect(() => rcCornerHz(0, 25e-6)).toThrow(new RangeError('ohms must be a positive number'))
    expect(() => rcCornerHz(130, -25e-6)).toThrow(/farads/)
    expect(() => capacitanceForCorner(130, 0)).toThrow(/hz/)
  })
})
