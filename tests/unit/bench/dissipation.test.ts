import { describe, expect, it } from 'vitest'
import {
  DEFAULT_IDLE_BANDS,
  cathodeCurrentPerTube,
  cathodeResistorFor,
  dissipationPercent,
  idleBand,
  idleCurrentForPercent,
  plateCurrentFromCathode,
  plateDissipation,
} from '../../../shared/utils/bench/index'

describe('plate dissipation', () => {
  it('6V6GT push-pull class AB1 at 285 V, 70 mA for two: 35 mA, 9.98 W, 71.3 % of 14 W', () => {
    // Source: RCA RC-30 tube manual, 6V6GT typical operation
    const perTube = 0.070 / 2
    const watts = plateDissipation(285, perTube)
    expect(perTube * 1000).toBeCloseTo(35, 12)
    expect(watts).toBeCloseTo(9.98, 2)
    expect(Math.abs(dissipationPercent(watts, 14) - 71.3)).toBeLessThanOrEqual(0.05 + 1e-9)
  })

  it('KT66 push-pull at 400 V, 62.5 mA for two: 12.5 W per tube, 50 % of 25 W', () => {
    // Source: Super Radiotron Valve Manual (AWV, 1962)
    const watts = plateDissipation(400, 0.0625 / 2)
    expect(watts).toBeCloseTo(12.5, 12)
    expect(dissipationPercent(watts, 25)).toBeCloseTo(50, 12)
  })

  it('330 Ω with 28.3 V, two 14 W tubes at about 400 V: close to 100 % after a 5–10 % screen share; resistor about 2.4 W', () => {
    // common practice, no source
    const cathodeAmps = cathodeCurrentPerTube(28.3, 330, 2)
    for (const screen of [0.05, 0.075, 0.10]) {
      const watts = plateDissipation(400 - 28.3, plateCurrentFromCathode(cathodeAmps, screen))
      const percent = dissipationPercent(watts, 14)
      // 100-110 rather than the quoted "about 100": 400 V and 5 % work out to 108 %.
      expect(percent).toBeGreaterThan(100)
      expect(percent).toBeLessThan(110)
    }
    const resistor = cathodeResistorFor(28.3, cathodeAmps, 2)
    expect(resistor.ohms).toBeCloseTo(330, 9)
    expect(resistor.watts).toBeCloseTo(2.4, 1)
    expect(resistor.minRatingWatts).toBeLessThan(10)
  })

  it('idle current for a percent inverts the dissipation', () => {
    // Source: P = V·I
    const amps = idleCurrentForPercent(400, 25, 70)
    expect(amps).toBeCloseTo(0.04375, 12)
    expect(dissipationPercent(plateDissipation(400, amps), 25)).toBeCloseTo(70, 9)
  })

  it('rejects impossible inputs, naming them', () => {
    expect(() => plateDissipation(0, 0.03)).toThrow(new RangeError('plateToCathodeVolts must be a positive number'))
    expect(() => plateDissipation(400, Number.NaN)).toThrow(/plateAmps/)
    expect(() => dissipationPercent(10, 0)).toThrow(/maxWatts/)
    expect(() => dissipationPercent(-1, 10)).toThrow(/watts/)
    expect(() => idleCurrentForPercent(400, 25, 0)).toThrow(/percent/)
    expect(() => idleCurrentForPercent(400, Number.POSITIVE_INFINITY, 70)).toThrow(/maxWatts/)
    expect(() => idleCurrentForPercent(-400, 25, 70)).toThrow(/plateToCathodeVolts/)
  })
})

describe('idle band', () => {
  // common practice, no source (thresholds as defined for the engine's defaults)
  it.each([
    [49.999, 'cold'],
    [50, 'in range'],
    [60, 'in range'],
    [70, 'in range'],
    [70.001, 'warm'],
    [100, 'warm'],
    [100.001, 'over'],
  ] as const)('fixed bias at %d %% is %s', (percent, band) => {
    expect(idleBand(percent, 'fixed')).toBe(band)
  })

  it.each([
    [0, 'cold'],
    [69.999, 'cold'],
    [70, 'in range'],
    [95, 'in range'],
    [95.001, 'warm'],
    [100, 'warm'],
    [100.001, 'over'],
    [140, 'over'],
  ] as const)('cathode bias at %d %% is %s', (percent, band) => {
    expect(idleBand(percent, 'cathode')).toBe(band)
  })

  it('exposes the defaults and keeps them frozen', () => {
    expect(DEFAULT_IDLE_BANDS.fixed).toEqual({ inRangeFrom: 50, inRangeTo: 70, overAbove: 100 })
    expect(DEFAULT_IDLE_BANDS.cathode).toEqual({ inRangeFrom: 70, inRangeTo: 95, overAbove: 100 })
    expect(Object.isFrozen(DEFAULT_IDLE_BANDS.fixed)).toBe(true)
  })

  it('takes a shop’s own thresholds without changing the defaults', () => {
    const shop = { inRangeFrom: 60, inRangeTo: 80, overAbove: 90 }
    expect(idleBand(55, 'fixed', shop)).toBe('cold')
    expect(idleBand(75, 'fixed', shop)).toBe('in range')
    expect(idleBand(85, 'fixed', shop)).toBe('warm')
    expect(idleBand(95, 'fixed', shop)).toBe('over')
    expect(idleBand(75, 'fixed')).toBe('warm')
  })

  it('rejects bad percent, mode or thresholds', () => {
    expect(() => idleBand(Number.NaN, 'fixed')).toThrow(new RangeError('percent must be a finite number'))
    expect(() => idleBand(50, 'class-a' as 'fixed')).toThrow(/mode/)
    expect(() => idleBand(50, 'fixed', { inRangeFrom: 80, inRangeTo: 70, overAbove: 100 })).toThrow(/thresholds/)
    expect(() => idleBand(50, 'fixed', { inRangeFrom: 50, inRangeTo: 70, overAbove: Number.NaN })).toThrow(/overAbove/)
  })
})
