import { describe, expect, it } from 'vitest'
import { capDrainSeconds, capEnergyJoules, capVoltageAfter, capacitanceForCorner, rcCornerHz } from '../../../shared/utils/bench/index'
import { highPassGain, inUnit, integratedCapEnergy, solvedDischarge } from './oracle'

describe('capDrainSeconds', () => {
  it('100 µF through 10 kΩ from 450 V to 50 V takes 2.20 s', () => {
    // Source: BENCH-MATH check value (RC discharge law). By hand: τ = 10 000 × 100e-6 = 1 s;
    // t = 1 × ln(450 / 50) = ln 9 = 2.1972 s
    expect(capDrainSeconds(450, 50, 100e-6, 10_000)).toBeCloseTo(2.1972, 4)
  })

  it('a 220 kΩ bleeder on 100 µF takes about 48 s from 450 V to 50 V', () => {
    // Source: SOURCES.md bleeder example. By hand: τ = 220 000 × 100e-6 = 22 s; t = 22 × 2.19722 = 48.339 s
    expect(capDrainSeconds(450, 50, 100e-6, 220_000)).toBeCloseTo(48.339, 3)
  })

  it('lands on the target when the discharge is solved numerically', () => {
    // Source: mathjs oracle, C·dV/dt = −V/R solved by its ODE solver
    for (const [v0, target, c, r] of [[450, 50, 100e-6, 220_000], [500, 5, 47e-6, 100_000]] as const) {
      expect(solvedDischarge(v0, capDrainSeconds(v0, target, c, r), c, r)).toBeCloseTo(target, 3)
    }
  })
})

describe('capVoltageAfter', () => {
  it('after one time constant 36.8 % remains: 165.6 V of 450 V', () => {
    // Source: RC discharge law (e⁻¹ = 0.367879). By hand: 450 × 0.367879 = 165.546 V
    expect(capVoltageAfter(450, 1, 100e-6, 10_000)).toBeCloseTo(165.546, 3)
    expect(capVoltageAfter(450, 0, 100e-6, 10_000)).toBe(450)
  })

  it('the bleeder example: 48 s through 220 kΩ on 100 µF leaves about 50.8 V', () => {
    // Source: SOURCES.md bleeder example. By hand: 48 / 22 = 2.181818; e^−2.181818 = 0.1128362; × 450 = 50.776 V
    expect(capVoltageAfter(450, 48, 100e-6, 220_000)).toBeCloseTo(50.776, 3)
  })

  it('agrees with the numerically solved discharge', () => {
    // Source: mathjs oracle, ODE solver
    for (const t of [0.5, 5, 30, 120]) {
      expect(capVoltageAfter(450, t, 100e-6, 220_000)).toBeCloseTo(solvedDischarge(450, t, 100e-6, 220_000), 3)
    }
  })
})

describe('capEnergyJoules', () => {
  it('100 µF at 450 V stores 10.1 J', () => {
    // Source: BENCH-MATH check value. By hand: ½ × 100e-6 × 450² = 0.5 × 100e-6 × 202 500 = 10.125 J
    expect(capEnergyJoules(100e-6, 450)).toBeCloseTo(10.125, 12)
  })

  it('a 40 µF reservoir at 500 V stores 5 J; at 0 V nothing', () => {
    // Source: hand calculation: ½ × 40e-6 × 250 000 = 5 J
    expect(capEnergyJoules(40e-6, 500)).toBeCloseTo(5, 12)
    expect(capEnergyJoules(40e-6, 0)).toBe(0)
  })

  it('agrees with W = ∫V dq integrated numerically, and with the units oracle', () => {
    // Source: mathjs oracle (trapezoid rule over the charge; ½CV² in J with units)
    expect(capEnergyJoules(100e-6, 450)).toBeCloseTo(integratedCapEnergy(100e-6, 450), 9)
    expect(capEnergyJoules(220e-6, 385)).toBeCloseTo(inUnit('0.5 * 220 uF * (385 V)^2', 'J'), 9)
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

describe('rcCornerHz', () => {
  it('130 Ω with 25 µF has its corner at 48.97 Hz', () => {
    // Source: BENCH-MATH check value (RC high-pass corner). By hand: 2π × 130 × 25e-6 = 0.0204204; 1 / 0.0204204 = 48.971 Hz
    expect(rcCornerHz(130, 25e-6)).toBeCloseTo(48.971, 3)
  })

  it('a 12AX7\'s 1667 Ω cathode resistor with 25 µF: 3.82 Hz', () => {
    // Source: SOURCES.md 12AX7 bias (−2 V at 1.2 mA → 1666.7 Ω) and a hand calculation:
    // 2π × 1666.67 × 25e-6 = 0.261799; 1 / 0.261799 = 3.8197 Hz
    expect(rcCornerHz(2 / 0.0012, 25e-6)).toBeCloseTo(3.8197, 4)
  })

  it('is where a first-order high-pass is 3 dB down, by complex arithmetic', () => {
    // Source: mathjs oracle: |H| = |jωRC / (1 + jωRC)| = 1/√2 at the corner
    for (const [r, c] of [[130, 25e-6], [1e6, 22e-9], [470e3, 0.1e-6]] as const) {
      expect(highPassGain(rcCornerHz(r, c), r, c)).toBeCloseTo(Math.SQRT1_2, 9)
    }
    expect(rcCornerHz(130, 25e-6)).toBeCloseTo(inUnit('1 / (2 pi 130 ohm 25 uF)', 'Hz'), 9)
  })
})

describe('capacitanceForCorner', () => {
  it('130 Ω for a 48.97 Hz corner needs 25 µF', () => {
    // Source: BENCH-MATH check value. By hand: 1 / (2π × 130 × 48.97) = 1 / 39 999.4 = 25.0004e-6 F
    expect(capacitanceForCorner(130, 48.97)).toBeCloseTo(25.0004e-6, 10)
  })

  it('a 1 MΩ grid leak for a 7.2 Hz corner needs 22.1 nF', () => {
    // Source: hand calculation: 2π × 1e6 × 7.2 = 45 238 934; 1 / 45 238 934 = 22.105e-9 F
    expect(capacitanceForCorner(1e6, 7.2)).toBeCloseTo(22.105e-9, 12)
  })

  it('gives a capacitor that puts the high-pass 3 dB down at that frequency', () => {
    // Source: mathjs oracle, complex transfer function
    for (const [r, hz] of [[130, 20], [1e6, 7.2], [1500, 10]] as const) {
      expect(highPassGain(hz, r, capacitanceForCorner(r, hz))).toBeCloseTo(Math.SQRT1_2, 9)
    }
  })

  it('rejects impossible inputs, naming them', () => {
    expect(() => rcCornerHz(0, 25e-6)).toThrow(new RangeError('ohms must be a positive number'))
    expect(() => rcCornerHz(130, -25e-6)).toThrow(/farads/)
    expect(() => capacitanceForCorner(130, 0)).toThrow(/hz/)
  })
})
