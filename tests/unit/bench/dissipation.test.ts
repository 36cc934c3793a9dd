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
  requireBiasMode,
  resolveIdleBandThresholds,
} from '../../../shared/utils/bench/index'
import { inUnit, ratio } from './oracle'

describe('plateDissipation and dissipationPercent', () => {
  it('6V6GTA push-pull class AB1 at 285 V, 70 mA for two: 35 mA, 9.98 W, 71.3 % of 14 W', () => {
    // Source: SOURCES.md, 6V6GTA operating point (RCA RC-30 p. 557, S2) and 14 W rating (S2).
    // By hand: 70 / 2 = 35 mA; 285 × 0.035 = 9.975 W; 9.975 / 14 = 0.71250 → 71.25 %
    const watts = plateDissipation(285, 0.035)
    expect(watts).toBeCloseTo(9.975, 12)
    expect(dissipationPercent(watts, 14)).toBeCloseTo(71.25, 12)
  })

  it('KT66 push-pull at 400 V, 62.5 mA for two: at most 12.5 W a tube, 50 % of 25 W', () => {
    // Source: SOURCES.md, KT66 operating point and 25 W rating (AWV 1962 via the encyclopedia, S1).
    // By hand: 62.5 / 2 = 31.25 mA; 400 × 0.03125 = 12.5 W; 12.5 / 25 = 50 %. The 62.5 mA includes
    // screen current, so the plate's own share is a little less: 12.5 W is an upper bound.
    const watts = plateDissipation(400, 0.03125)
    expect(watts).toBeCloseTo(12.5, 12)
    expect(dissipationPercent(watts, 25)).toBeCloseTo(50, 12)
  })

  it('6550A at 450 V, 150 mA for two: 33.75 W a tube, 80.4 % of 42 W; at 600 V and 50 mA, 71.4 %', () => {
    // Source: SOURCES.md, 6550A operating points (GE 4-72 via a code comment, S2) and 42 W rating (S2).
    // By hand: 450 × 0.075 = 33.75 W; 33.75 / 42 = 0.80357 → 80.357 %. 600 × 0.050 = 30 W; 30 / 42 = 71.429 %
    expect(plateDissipation(450, 0.075)).toBeCloseTo(33.75, 12)
    expect(dissipationPercent(33.75, 42)).toBeCloseTo(80.357, 3)
    expect(dissipationPercent(plateDissipation(600, 0.050), 42)).toBeCloseTo(71.429, 3)
  })

  it('a 12AX7 section at 250 V and 1.2 mA: 0.3 W, 30 % of 1 W', () => {
    // Source: SOURCES.md, 12AX7 operating point and 1 W a section (Sylvania via the encyclopedia, S1).
    // By hand: 250 × 0.0012 = 0.3 W; 0.3 / 1 = 30 %
    expect(plateDissipation(250, 0.0012)).toBeCloseTo(0.3, 12)
    expect(dissipationPercent(0.3, 1)).toBeCloseTo(30, 12)
  })

  it('agrees with the units oracle', () => {
    // Source: mathjs oracle with units, P = V·I and the share of a rating
    expect(plateDissipation(285, 0.035)).toBeCloseTo(inUnit('285 V * 35 mA', 'W'), 12)
    expect(dissipationPercent(9.975, 14)).toBeCloseTo(ratio('9.975 W / 14 W * 100'), 12)
  })

  it('330 Ω with 28.3 V, two 6V6GTA (14 W) at about 400 V: over 100 % after a 5–10 % screen share; resistor about 2.4 W', () => {
    // common practice, no source. By hand: 28.3 / 330 / 2 = 42.879 mA a tube; 400 − 28.3 = 371.7 V.
    // 5 % screen: 42.879 × 0.95 = 40.735 mA; × 371.7 = 15.141 W = 108.15 % of 14 W.
    // 10 % screen: 42.879 × 0.90 = 38.591 mA; × 371.7 = 14.344 W = 102.46 %. Resistor: 28.3² / 330 = 2.427 W
    const cathodeAmps = cathodeCurrentPerTube(28.3, 330, 2)
    expect(cathodeAmps).toBeCloseTo(0.042879, 6)
    const at = (screen: number) => dissipationPercent(plateDissipation(371.7, plateCurrentFromCathode(cathodeAmps, screen)), 14)
    expect(at(0.05)).toBeCloseTo(108.15, 2)
    expect(at(0.10)).toBeCloseTo(102.46, 2)
    const resistor = cathodeResistorFor(28.3, cathodeAmps, 2)
    expect(resistor.ohms).toBeCloseTo(330, 9)
    expect(resistor.watts).toBeCloseTo(2.427, 3)
  })

  it('rejects impossible inputs, naming them', () => {
    expect(() => plateDissipation(0, 0.03)).toThrow(new RangeError('plateToCathodeVolts must be a positive number'))
    expect(() => plateDissipation(400, Number.NaN)).toThrow(/plateAmps/)
    expect(() => dissipationPercent(10, 0)).toThrow(/maxWatts/)
    expect(() => dissipationPercent(-1, 10)).toThrow(/watts/)
  })
})

describe('idleCurrentForPercent', () => {
  it('70 % of 25 W at 450 V is 38.9 mA, which drops 1.59 V across a 41 Ω half primary', () => {
    // Source: BENCH-MATH transformer-resistance check value (common practice, no source).
    // By hand: 0.70 × 25 = 17.5 W; 17.5 / 450 = 0.038889 A; × 41 Ω = 1.5944 V
    const amps = idleCurrentForPercent(450, 25, 70)
    expect(amps).toBeCloseTo(0.038889, 6)
    expect(amps * 41).toBeCloseTo(1.5944, 4)
  })

  it('the 6V6GTA operating point backwards: 71.25 % of 14 W at 285 V is its 35 mA', () => {
    // Source: SOURCES.md, 6V6GTA 285 V, 70 mA for two (S2). By hand: 0.7125 × 14 = 9.975 W; / 285 = 0.035 A
    expect(idleCurrentForPercent(285, 14, 71.25)).toBeCloseTo(0.035, 12)
  })

  it('70 % of 25 W at 400 V is 43.75 mA', () => {
    // Source: hand calculation: 0.70 × 25 = 17.5 W; 17.5 / 400 = 0.04375 A
    expect(idleCurrentForPercent(400, 25, 70)).toBeCloseTo(0.04375, 12)
  })

  it('agrees with the units oracle', () => {
    // Source: mathjs oracle, I = (share × rating) / V
    expect(idleCurrentForPercent(450, 42, 80)).toBeCloseTo(inUnit('80 / 100 * 42 W / 450 V', 'A'), 12)
  })

  it('rejects impossible inputs, naming them', () => {
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
  ] as const)('fixed bias at %d percent is %s', (percent, band) => {
    // common practice, no source (BENCH-MATH: fixed, in range 50-70 %)
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
  ] as const)('cathode bias at %d percent is %s', (percent, band) => {
    // common practice, no source (BENCH-MATH: cathode, in range 70-95 %)
    expect(idleBand(percent, 'cathode')).toBe(band)
  })

  it('puts the published operating points where a tech would expect them', () => {
    // Source: SOURCES.md operating points, by hand above (6V6GTA 71.25 %, KT66 50 %, 6550A 80.36 %, 12AX7 30 %);
    // bands: BENCH-MATH definitions (common practice, no source)
    expect(idleBand(71.25, 'fixed')).toBe('warm')
    expect(idleBand(50, 'fixed')).toBe('in range')
    expect(idleBand(80.357, 'fixed')).toBe('warm')
    expect(idleBand(80.357, 'cathode')).toBe('in range')
    expect(idleBand(30, 'cathode')).toBe('cold')
  })

  it('resolves the default thresholds BENCH-MATH defines for each of the two bias modes', () => {
    // Source: BENCH-MATH, idleBand definitions (common practice, no source); mode is 'fixed' | 'cathode'
    expect(resolveIdleBandThresholds(requireBiasMode('fixed'))).toEqual({ inRangeFrom: 50, inRangeTo: 70, overAbove: 100 })
    expect(resolveIdleBandThresholds(requireBiasMode('cathode'))).toEqual({ inRangeFrom: 70, inRangeTo: 95, overAbove: 100 })
  })

  it('takes a shop\'s own thresholds in order, and no mode but the two', () => {
    // Source: BENCH-MATH: a shop may change its own thresholds; bad input throws a RangeError naming the input
    const shop = { inRangeFrom: 55, inRangeTo: 65, overAbove: 90 }
    expect(resolveIdleBandThresholds(requireBiasMode('fixed'), shop)).toBe(shop)
    expect(() => resolveIdleBandThresholds('fixed', { inRangeFrom: 70, inRangeTo: 60, overAbove: 90 })).toThrow(/thresholds/)
    expect(() => requireBiasMode('class-a')).toThrow(new RangeError("mode must be 'fixed' or 'cathode'"))
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
