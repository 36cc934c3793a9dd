import { describe, expect, it } from 'vitest'
import {
  BENCH_TOOL_IDS,
  ENGINE_VERSION,
  computeTool,
  isBenchToolId,
  parseToolInputs,
  verifySavedResult,
} from '../../../shared/utils/bench/index'
import type { BenchToolId, BenchToolRawInputs } from '../../../shared/utils/bench/index'

const SAMPLES: { [K in BenchToolId]: BenchToolRawInputs[K] } = {
  'idle-dissipation': { mode: 'fixed', maxPlateWatts: 14, plateVolts: 285, method: 'direct', amps: 0.035 },
  'cathode-resistor': { target: 'current', cathodeVolts: 10.4, cathodeAmpsPerTube: 0.04, tubesSharing: 2, bypassCornerHz: 48.97 },
  'bias-supply': { tapVoltsRms: 50, diodeDropVolts: 0.7, topOhms: 10_000, potOhms: 25_000, bottomOhms: 15_000, targetGridVolts: -48 },
  'clean-power': { loadOhms: 8, readingA: { kind: 'vpp', volts: 33.2 }, readingB: { kind: 'vpp', volts: 38.4 } },
  'cap-drain': { farads: 100e-6, startVolts: 450, targetVolts: 50, ohms: 10_000, seconds: 5 },
  'load-reflection': { primaryOhms: 8000, secondaryOhms: 8, speakerOhms: 16 },
  'rc-corner': { solveFor: 'hz', ohms: 130, farads: 25e-6 },
  'tube-sorter': {
    readings: [{ id: 'a', amps: 0.030 }, { id: 'b', amps: 0.0305 }, { id: 'c', amps: 0.040 }, { id: 'd', amps: 0.033 }],
    setSize: 2,
    tolerance: 0.05,
  },
}

const roundTrip = <T>(value: T): T => JSON.parse(JSON.stringify(value)) as T

describe('computeTool', () => {
  it('has a sample for every tool and returns plain JSON without undefined fields', () => {
    expect(Object.keys(SAMPLES).sort()).toEqual([...BENCH_TOOL_IDS].sort())
    for (const id of BENCH_TOOL_IDS) {
      const out = computeTool(id, SAMPLES[id])
      expect(roundTrip(out)).toEqual(out)
      expect(JSON.stringify(out)).not.toMatch(/null/)
      expect(Object.values(out)).not.toContain(undefined)
    }
  })

  describe('idle-dissipation', () => {
    it('direct plate current: 6V6GTA at 285 V, 35 mA is 9.98 W, 71.3 % of 14 W, warm in fixed bias', () => {
      // Source: SOURCES.md, 6V6GTA 285 V, 70 mA for the pair (RCA RC-30 p. 557 via a code comment, S2), 14 W (S2).
      // By hand: 285 × 0.035 = 9.975 W; 9.975 / 14 = 71.25 %
      const out = computeTool('idle-dissipation', SAMPLES['idle-dissipation'])
      expect(out.watts).toBeCloseTo(9.975, 12)
      expect(out.percent).toBeCloseTo(71.25, 12)
      expect(out.plateToCathodeVolts).toBe(285)
      expect(out.cathodeAmpsPerTube).toBeUndefined()
      // common practice, no source (fixed-bias band 50-70 %). By hand: 50 % of 14 W = 7 W, / 285 V = 24.561 mA;
      // 70 % = 9.8 W, / 285 V = 34.386 mA
      expect(out.band).toBe('warm')
      expect(out.inRangeAmps.min).toBeCloseTo(0.024561, 6)
      expect(out.inRangeAmps.max).toBeCloseTo(0.034386, 6)
    })

    it('KT66 at 400 V, 31.25 mA is 50 % of 25 W, the cold edge of in range for fixed bias', () => {
      // Source: Super Radiotron Valve Manual (AWV, 1962)
      const out = computeTool('idle-dissipation', { mode: 'fixed', maxPlateWatts: 25, plateVolts: 400, method: 'direct', amps: 0.03125 })
      expect(out.watts).toBeCloseTo(12.5, 12)
      expect(out.percent).toBeCloseTo(50, 12)
      expect(out.band).toBe('in range')
    })

    it('sense resistor reads cathode current: a 6L6GC at 450 V, 40 mV across 1 Ω, the default 5 % screen share off', () => {
      // Source: SOURCES.md, 6L6GC 450 V plate and 30 W (GE 1973 via the encyclopedia, S1); Kirchhoff's current law
      // (cathode = plate + screen); the 5 % default is common practice, no source.
      // By hand: 0.040 V / 1 Ω = 40 mA cathode; × 0.95 = 38 mA plate; 450 − 0.040 = 449.96 V plate to cathode;
      // 449.96 × 0.038 = 17.0985 W; 17.0985 / 30 = 56.995 %
      const out = computeTool('idle-dissipation', {
        mode: 'fixed', maxPlateWatts: 30, plateVolts: 450, method: 'sense-resistor', senseVolts: 0.040, senseOhms: 1,
      })
      expect(out.cathodeAmpsPerTube).toBeCloseTo(0.040, 12)
      expect(out.plateAmps).toBeCloseTo(0.038, 12)
      expect(out.plateToCathodeVolts).toBeCloseTo(449.96, 12)
      expect(out.watts).toBeCloseTo(17.09848, 9)
      expect(out.percent).toBeCloseTo(56.995, 3)
      expect(out.band).toBe('in range')
    })

    it('a 12AX7 section at 250 V and 1.2 mA idles at 30 % of its 1 W: cold for a power-tube band', () => {
      // Source: SOURCES.md, 12AX7 250 V, 1.2 mA, 1 W a section (Sylvania via the encyclopedia, S1).
      // By hand: 250 × 0.0012 = 0.3 W = 30 %; bands are common practice, no source
      const out = computeTool('idle-dissipation', { mode: 'cathode', maxPlateWatts: 1, plateVolts: 252, method: 'direct', amps: 0.0012, cathodeVolts: 2 })
      expect(out.plateToCathodeVolts).toBe(250)
      expect(out.watts).toBeCloseTo(0.3, 12)
      expect(out.percent).toBeCloseTo(30, 12)
      expect(out.band).toBe('cold')
    })

    it('cathode resistor: 330 Ω, 28.3 V, two 6V6GTA (14 W) at 400 V, 10 % screen share is over 100 %', () => {
      // common practice, no source (the example); 14 W is the 6V6GTA's rating (SOURCES.md, S2).
      // By hand: 400 − 28.3 = 371.7 V; 28.3 / 330 / 2 = 42.879 mA a tube; × 0.9 = 38.591 mA plate;
      // 371.7 × 0.038591 = 14.344 W; 14.344 / 14 = 102.46 %
      const out = computeTool('idle-dissipation', {
        mode: 'cathode', maxPlateWatts: 14, plateVolts: 400, method: 'cathode-resistor',
        cathodeVolts: 28.3, cathodeOhms: 330, tubesSharing: 2, screenFraction: 0.1,
      })
      expect(out.plateToCathodeVolts).toBeCloseTo(371.7, 9)
      expect(out.cathodeAmpsPerTube).toBeCloseTo(0.042879, 6)
      expect(out.plateAmps).toBeCloseTo(0.038591, 6)
      expect(out.percent).toBeCloseTo(102.46, 2)
      expect(out.band).toBe('over')
    })

    it('drop across the half primary is plate current: no screen share taken off', () => {
      // common practice, no source (BENCH-MATH: 41 Ω half primary, 450 V, 70 % of 25 W: 38.9 mA, 1.59 V).
      // By hand: 1.59 / 41 = 38.780 mA; 450 × 0.038780 = 17.451 W; 17.451 / 25 = 69.80 %
      const out = computeTool('idle-dissipation', {
        mode: 'fixed', maxPlateWatts: 25, plateVolts: 450, method: 'primary-drop',
        dropVolts: 1.59, halfPrimaryOhms: 41,
      })
      expect(out.plateAmps).toBeCloseTo(0.038780, 6)
      expect(out.percent).toBeCloseTo(69.80, 2)
      expect(out.band).toBe('in range')
    })

    it('uses a shop’s own band thresholds', () => {
      // Source: hand calculation: 75 % of 14 W = 10.5 W; / 285 V = 36.842 mA
      const out = computeTool('idle-dissipation', {
        ...SAMPLES['idle-dissipation'], bandThresholds: { inRangeFrom: 60, inRangeTo: 75, overAbove: 100 },
      })
      expect(out.band).toBe('in range')
      expect(out.inRangeAmps.max).toBeCloseTo(0.036842, 6)
    })

    it('rejects bad inputs with a message naming the field', () => {
      const base = SAMPLES['idle-dissipation']
      expect(() => computeTool('idle-dissipation', { ...base, plateVolts: 0 })).toThrow(new RangeError('plateVolts must be a positive number'))
      expect(() => computeTool('idle-dissipation', { ...base, amps: Number.NaN })).toThrow(/amps/)
      expect(() => computeTool('idle-dissipation', { ...base, cathodeVolts: 300 })).toThrow(/cathodeVolts must be below plateVolts/)
      expect(() => computeTool('idle-dissipation', { ...base, method: 'clamp-meter' })).toThrow(/method/)
      expect(() => computeTool('idle-dissipation', { ...base, mode: 'class-a' })).toThrow(/mode/)
      expect(() => computeTool('idle-dissipation', {
        mode: 'cathode', maxPlateWatts: 12, plateVolts: 300, method: 'cathode-resistor',
        cathodeVolts: 10, cathodeOhms: 130, tubesSharing: 2, screenFraction: 1,
      })).toThrow(/screenFraction/)
      expect(() => computeTool('idle-dissipation', {
        mode: 'cathode', maxPlateWatts: 12, plateVolts: 300, method: 'cathode-resistor',
        cathodeVolts: 10, cathodeOhms: 130, tubesSharing: 0,
      })).toThrow(/tubesSharing/)
    })

    it('fills the screen share default when normalising inputs', () => {
      // Source: BENCH-MATH, Idle dissipation: screen share default 5 %, applied only to cathode-side readings
      // (the 5 % itself is common practice, no source)
      const parsed = parseToolInputs('idle-dissipation', {
        mode: 'cathode', maxPlateWatts: 12, plateVolts: 300, method: 'cathode-resistor',
        cathodeVolts: 10, cathodeOhms: 130, tubesSharing: 2,
      })
      expect(parsed).toMatchObject({ screenFraction: 0.05 })
    })
  })

  describe('cathode-resistor', () => {
    it('EL84 pair at 10.4 V and 40 mA each: 130 Ω (E24 130, E12 120), 0.83 W, and 25 µF for a 48.97 Hz corner', () => {
      // Source: BENCH-MATH EL84 check value (Philips EL84 data, recalled from memory).
      // By hand: 10.4 / (2 × 0.040) = 130 Ω; 10.4² / 130 = 0.832 W
      const out = computeTool('cathode-resistor', SAMPLES['cathode-resistor'])
      expect(out.ohms).toBeCloseTo(130, 9)
      expect(out.nearestE24).toBe(130)
      expect(out.nearestE12).toBe(120)
      expect(out.watts).toBeCloseTo(0.832, 9)
      // common practice, no source (rating at twice the dissipation): 2 × 0.832 = 1.664 W
      expect(out.minRatingWatts).toBeCloseTo(1.664, 9)
      // Source: RC high-pass corner
      expect(out.bypassFarads).toBeCloseTo(25e-6, 9)
      expect(out.plateAmpsPerTube).toBeUndefined()
    })

    it('from a target percent: two 6V6GTA (14 W), 400 V, 28.3 V at the cathode, 100 %, 10 % screen: about 330 Ω', () => {
      // common practice, no source (the example); 14 W: SOURCES.md, 6V6GTA (S2).
      // By hand: 400 − 28.3 = 371.7 V; 14 W / 371.7 V = 37.665 mA plate; / 0.9 = 41.850 mA cathode;
      // × 2 tubes = 83.700 mA; 28.3 / 0.083700 = 338.11 Ω → E12 330 Ω (log-nearest of 270 / 330 / 390)
      const out = computeTool('cathode-resistor', {
        target: 'percent', percent: 100, plateVolts: 400, maxPlateWatts: 14, screenFraction: 0.1,
        cathodeVolts: 28.3, tubesSharing: 2,
      })
      expect(out.plateAmpsPerTube).toBeCloseTo(0.037665, 6)
      expect(out.cathodeAmpsPerTube).toBeCloseTo(0.041850, 6)
      expect(out.ohms).toBeCloseTo(338.11, 2)
      expect(out.nearestE12).toBe(330)
      expect(out.bypassFarads).toBeUndefined()
    })

    it('rejects bad inputs', () => {
      expect(() => computeTool('cathode-resistor', { ...SAMPLES['cathode-resistor'], tubesSharing: 1.5 })).toThrow(/tubesSharing/)
      expect(() => computeTool('cathode-resistor', { target: 'volts' })).toThrow(/target/)
      expect(() => computeTool('cathode-resistor', {
        target: 'percent', percent: 70, plateVolts: 20, maxPlateWatts: 12, cathodeVolts: 25, tubesSharing: 2,
      })).toThrow(/cathodeVolts must be below plateVolts/)
    })
  })

  describe('bias-supply', () => {
    it('50 Vrms tap, 0.7 V diode: −70.0 V rail, and a −48 V target sits inside with 8 V to spare', () => {
      // Source: half-wave peak; voltage divider rule. By hand: 50 × √2 − 0.7 = 70.011 → −70.011 V;
      // × 15/50 = −21.003 V; × 40/50 = −56.009 V; −48 V is 8.009 V from the most negative end and
      // 26.997 V from the other, so the margin is 8.009 V
      const out = computeTool('bias-supply', SAMPLES['bias-supply'])
      expect(out.dcVolts).toBeCloseTo(-70.011, 3)
      expect(out.leastNegativeVolts).toBeCloseTo(-21.003, 3)
      expect(out.mostNegativeVolts).toBeCloseTo(-56.009, 3)
      expect(out.targetInside).toBe(true)
      expect(out.marginVolts).toBeCloseTo(8.009, 3)
    })

    it('the 6V6GTA\'s −19 V lies outside this range, 2.0 V short of its least negative end', () => {
      // Source: SOURCES.md, 6V6GTA grid −19 V (S2); by hand: −21.003 − (−19) = −2.003 V
      const out = computeTool('bias-supply', { ...SAMPLES['bias-supply'], targetGridVolts: -19 })
      expect(out.targetInside).toBe(false)
      expect(out.marginVolts).toBeCloseTo(-2.003, 3)
      // By hand: −60 − (−56.009) = −3.991 V beyond the most negative end
      expect(computeTool('bias-supply', { ...SAMPLES['bias-supply'], targetGridVolts: -60 }).marginVolts).toBeCloseTo(-3.991, 3)
      const none = computeTool('bias-supply', { ...SAMPLES['bias-supply'], targetGridVolts: undefined })
      expect(none).not.toHaveProperty('targetInside')
    })

    it('rejects a positive grid target', () => {
      expect(() => computeTool('bias-supply', { ...SAMPLES['bias-supply'], targetGridVolts: 40 })).toThrow(new RangeError('targetGridVolts must be a negative number'))
    })
  })

  describe('clean-power', () => {
    it('33.2 Vpp then 38.4 Vpp into 8 Ω: about 17 W and 23 W, about 6 W and 1.26 dB apart', () => {
      // Source: hand calculation, P = Vpp² / (8·R): 33.2² = 1102.24, / 64 = 17.2225 W;
      // 38.4² = 1474.56, / 64 = 23.04 W; difference 5.8175 W
      const out = computeTool('clean-power', SAMPLES['clean-power'])
      expect(out.vrmsA).toBeCloseTo(11.738, 3)
      expect(out.wattsA).toBeCloseTo(17.2225, 9)
      expect(out.wattsB).toBeCloseTo(23.04, 9)
      expect(out.differenceWatts).toBeCloseTo(5.8175, 9)
      // Source: definition of the decibel: 10·log10(23.04 / 17.2225) = 10 × 0.126387 = 1.2639 dB
      expect(out.differenceDb).toBeCloseTo(1.2639, 4)
    })

    it('a meter reading in Vrms: 20.0 Vrms into 8 Ω is 50 W', () => {
      // Source: Ohm's law / sine RMS
      const out = computeTool('clean-power', { loadOhms: 8, readingA: { kind: 'vrms', volts: 20 } })
      expect(out).toEqual({ vrmsA: 20, wattsA: 50 })
    })

    it('rejects a missing load', () => {
      expect(() => computeTool('clean-power', { loadOhms: 0, readingA: { kind: 'vpp', volts: 30 } })).toThrow(new RangeError('loadOhms must be a positive number'))
      expect(() => computeTool('clean-power', { loadOhms: 8, readingA: { kind: 'dbu', volts: 30 } })).toThrow(/readingA\.kind/)
    })
  })

  describe('cap-drain', () => {
    it('100 µF, 10 kΩ, 450 V to 50 V: 2.20 s, 10.1 J; 5 s later 450·e⁻⁵ V remain', () => {
      // Source: BENCH-MATH check values (RC discharge law). By hand: τ = 10 kΩ × 100 µF = 1 s;
      // ln 9 = 2.1972 s; ½ × 100e-6 × 450² = 10.125 J; 450 × e⁻⁵ = 450 × 0.0067379 = 3.0321 V
      const out = computeTool('cap-drain', SAMPLES['cap-drain'])
      expect(out.drainSeconds).toBeCloseTo(2.1972, 4)
      expect(out.energyJoules).toBeCloseTo(10.125, 12)
      expect(out.timeConstantSeconds).toBeCloseTo(1, 12)
      expect(out.voltsAfterSeconds).toBeCloseTo(3.0321, 4)
    })

    it('rejects a target at or above the start', () => {
      expect(() => computeTool('cap-drain', { ...SAMPLES['cap-drain'], targetVolts: 450 })).toThrow(new RangeError('targetVolts must be below startVolts'))
      expect(() => computeTool('cap-drain', { ...SAMPLES['cap-drain'], seconds: -1 })).toThrow(/seconds/)
    })
  })

  describe('load-reflection', () => {
    it('8 kΩ:8 Ω with 16 Ω on the tap: ratio 31.62, 16 kΩ reflected, twice nominal is not yet flagged', () => {
      // Source: BENCH-MATH check value (reflected impedance law): √1000 = 31.623; 16 × 1000 = 16 kΩ; 16 / 8 = 2
      const out = computeTool('load-reflection', SAMPLES['load-reflection'])
      expect(out.turnsRatio).toBeCloseTo(31.623, 3)
      expect(out.reflectedOhms).toBeCloseTo(16_000, 6)
      expect(out.mismatchRatio).toBeCloseTo(2, 12)
      // common practice, no source (flag beyond a factor of 2)
      expect(out.mismatch).toBe(false)
    })

    it('flags a 4 Ω speaker on the 16 Ω tap', () => {
      // Source: reflected impedance law, by hand: 4 × 8000 / 16 = 2000 Ω, a quarter of nominal;
      // flag threshold is common practice, no source
      const out = computeTool('load-reflection', { primaryOhms: 8000, secondaryOhms: 16, speakerOhms: 4 })
      expect(out.reflectedOhms).toBeCloseTo(2000, 9)
      expect(out.mismatch).toBe(true)
    })
  })

  describe('rc-corner', () => {
    it('130 Ω with 25 µF: 48.97 Hz, and back', () => {
      // Source: BENCH-MATH check value (RC high-pass corner). By hand: 1 / (2π × 130 × 25e-6) = 48.971 Hz
      expect(computeTool('rc-corner', SAMPLES['rc-corner']).hz).toBeCloseTo(48.971, 3)
      expect(computeTool('rc-corner', { solveFor: 'farads', ohms: 130, hz: 48.97 }).farads).toBeCloseTo(25.0004e-6, 10)
    })

    it('rejects a missing capacitor', () => {
      expect(() => computeTool('rc-corner', { solveFor: 'hz', ohms: 130 })).toThrow(/farads/)
    })
  })

  describe('tube-sorter', () => {
    it('returns the matched sets', () => {
      // Source: definition of a matched set (largest ≤ (1 + tolerance) · smallest)
      const out = computeTool('tube-sorter', SAMPLES['tube-sorter'])
      expect(out.sets.map(s => s.ids)).toEqual([['a', 'b']])
      expect(out.unmatched).toEqual(['c', 'd'])
    })

    it('rejects repeated ids and a set size of 1', () => {
      expect(() => computeTool('tube-sorter', { readings: [{ id: 'a', amps: 0.03 }, { id: 'a', amps: 0.03 }], setSize: 2, tolerance: 0.05 })).toThrow(/unique/)
      expect(() => computeTool('tube-sorter', { ...SAMPLES['tube-sorter'], setSize: 1 })).toThrow(/setSize/)
      expect(() => computeTool('tube-sorter', { ...SAMPLES['tube-sorter'], tolerance: -0.1 })).toThrow(/tolerance/)
    })
  })

  it('rejects an unknown tool', () => {
    expect(() => computeTool('ohm-wizard' as BenchToolId, {})).toThrow(/toolId/)
  })
})

describe('isBenchToolId and parseToolInputs', () => {
  it('knows exactly the eight bench tools', () => {
    // Source: BENCH-MATH, "What each bench tool shows" (eight tools, in this order)
    expect([...BENCH_TOOL_IDS]).toEqual(['idle-dissipation', 'cathode-resistor', 'bias-supply', 'clean-power', 'cap-drain', 'load-reflection', 'rc-corner', 'tube-sorter'])
    for (const id of BENCH_TOOL_IDS) expect(isBenchToolId(id)).toBe(true)
  })

  it('knows nothing else, not even a tool name in other letters', () => {
    // Source: BENCH-MATH, "What each bench tool shows" (tool names as listed)
    for (const other of ['ohm-wizard', '', 'Idle-Dissipation', 'idle dissipation', 7, null, undefined]) expect(isBenchToolId(other)).toBe(false)
  })

  it('passes the primary-drop method through without a screen share, and names a bad field in a RangeError', () => {
    // Source: BENCH-MATH: the screen share applies only to cathode-side readings; bad input throws a RangeError
    // whose message names the input
    const parsed = parseToolInputs('idle-dissipation', { mode: 'fixed', maxPlateWatts: 25, plateVolts: 450, method: 'primary-drop', dropVolts: 1.59, halfPrimaryOhms: 41 })
    expect(parsed).not.toHaveProperty('screenFraction')
    expect(() => parseToolInputs('cap-drain', { farads: 100e-6, startVolts: 450, targetVolts: 50, ohms: -1 })).toThrow(new RangeError('ohms must be a positive number'))
    expect(() => parseToolInputs('ohm-wizard' as BenchToolId, {})).toThrow(RangeError)
  })
})

// Source for this block: the engine's contract (DEVELOPERS.md, "How to add a bench tool": the server
// re-checks saved results by recomputing them); the inputs are the check values above.
describe('verifySavedResult', () => {
  const saved = <K extends BenchToolId>(tool: K) => ({
    tool,
    inputs: roundTrip(SAMPLES[tool]),
    outputs: roundTrip(computeTool(tool, SAMPLES[tool])),
    engineVersion: ENGINE_VERSION,
  })

  it.each([...BENCH_TOOL_IDS])('accepts untouched %s outputs after a JSON round trip', (tool) => {
    // Source: DEVELOPERS.md (saved results are recomputed); inputs are the check values above
    expect(verifySavedResult(saved(tool))).toEqual({ ok: true })
  })

  it('tolerates rounding noise far below 1e-9', () => {
    const s = saved('idle-dissipation')
    s.outputs.watts *= 1 + 1e-12
    expect(verifySavedResult(s)).toEqual({ ok: true })
  })

  it('refuses a tampered number, naming it', () => {
    // Source: DEVELOPERS.md (saved results are recomputed): 9.975 W for the 6V6GTA sample (SOURCES.md, S2), off by a millionth
    const s = saved('idle-dissipation')
    s.outputs.watts *= 1 + 1e-6
    const verdict = verifySavedResult(s)
    expect(verdict.ok).toBe(false)
    expect(!verdict.ok && verdict.reason).toMatch(/outputs\.watts/)
  })

  it('refuses a tampered band, a nested value, an extra and a missing field', () => {
    const band = saved('idle-dissipation')
    band.outputs.band = 'in range'
    expect(verifySavedResult(band).ok).toBe(false)

    const nested = saved('idle-dissipation')
    nested.outputs.inRangeAmps.max = 1
    expect(verifySavedResult(nested)).toMatchObject({ ok: false, reason: expect.stringMatching(/inRangeAmps\.max/) })

    const extra = saved('cap-drain')
    expect(verifySavedResult({ ...extra, outputs: { ...extra.outputs, safe: true } }).ok).toBe(false)

    const missing = saved('cap-drain')
    const { voltsAfterSeconds: _dropped, ...rest } = missing.outputs
    expect(verifySavedResult({ ...missing, outputs: rest }).ok).toBe(false)
  })

  it('refuses swapped or relabelled tubes in a sort', () => {
    const s = saved('tube-sorter')
    s.outputs.sets[0]!.ids = ['b', 'a']
    expect(verifySavedResult(s).ok).toBe(false)
    const t = saved('tube-sorter')
    t.outputs.unmatched = ['c']
    expect(verifySavedResult(t).ok).toBe(false)
  })

  it('treats zero exactly: a spread of 1e-10 where the inputs give 0 is refused', () => {
    const inputs = { readings: [{ id: 'a', amps: 0.03 }, { id: 'b', amps: 0.03 }], setSize: 2, tolerance: 0 }
    const outputs = roundTrip(computeTool('tube-sorter', inputs))
    expect(outputs.sets[0]!.spreadFraction).toBe(0)
    expect(verifySavedResult({ tool: 'tube-sorter', inputs, outputs, engineVersion: ENGINE_VERSION })).toEqual({ ok: true })
    outputs.sets[0]!.spreadFraction = 1e-10
    expect(verifySavedResult({ tool: 'tube-sorter', inputs, outputs, engineVersion: ENGINE_VERSION }).ok).toBe(false)
  })

  it('refuses outputs that belong to other inputs', () => {
    // Source: BENCH-MATH cap-drain check values: 10 kΩ gives 2.1972 s, 20 kΩ would give twice that
    const s = saved('cap-drain')
    expect(verifySavedResult({ ...s, inputs: { ...s.inputs, ohms: 20_000 } }).ok).toBe(false)
  })

  it('refuses unknown tools, invalid inputs, non-finite outputs and other engine majors', () => {
    const s = saved('rc-corner')
    expect(verifySavedResult({ ...s, tool: 'ohm-wizard' })).toMatchObject({ ok: false, reason: expect.stringMatching(/unknown bench tool/) })
    expect(verifySavedResult({ ...s, inputs: { ...s.inputs, ohms: -1 } })).toMatchObject({ ok: false, reason: expect.stringMatching(/^inputs rejected: ohms/) })
    expect(verifySavedResult({ ...s, outputs: { ...s.outputs, hz: Number.NaN } }).ok).toBe(false)
    expect(verifySavedResult({ ...s, outputs: { ...s.outputs, hz: String(s.outputs.hz) } }).ok).toBe(false)
    expect(verifySavedResult({ ...s, outputs: null }).ok).toBe(false)
    expect(verifySavedResult({ ...s, engineVersion: 'latest' }).ok).toBe(false)
    const [major, minor] = ENGINE_VERSION.split('.').map(Number) as [number, number]
    expect(verifySavedResult({ ...s, engineVersion: `${major + 1}.0.0` }).ok).toBe(false)
    expect(verifySavedResult({ ...s, engineVersion: `${major}.${minor + 1}.0` })).toEqual({ ok: true })
  })
})
