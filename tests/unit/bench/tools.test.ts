import { describe, expect, it } from 'vitest'
import {
  BENCH_TOOL_IDS,
  ENGINE_VERSION,
  computeTool,
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
    it('direct plate current: 6V6GT at 285 V, 35 mA is 9.98 W, 71.3 % of 14 W, warm in fixed bias', () => {
      // Source: RCA RC-30 tube manual, 6V6GT typical operation
      const out = computeTool('idle-dissipation', SAMPLES['idle-dissipation'])
      expect(out.watts).toBeCloseTo(9.98, 2)
      expect(Math.abs(out.percent - 71.3)).toBeLessThanOrEqual(0.05 + 1e-9)
      expect(out.plateToCathodeVolts).toBe(285)
      expect(out.cathodeAmpsPerTube).toBeUndefined()
      // common practice, no source (fixed-bias band 50-70 %)
      expect(out.band).toBe('warm')
      expect(out.inRangeAmps.min).toBeCloseTo(0.5 * 14 / 285, 12)
      expect(out.inRangeAmps.max).toBeCloseTo(0.7 * 14 / 285, 12)
    })

    it('KT66 at 400 V, 31.25 mA is 50 % of 25 W, the cold edge of in range for fixed bias', () => {
      // Source: Super Radiotron Valve Manual (AWV, 1962)
      const out = computeTool('idle-dissipation', { mode: 'fixed', maxPlateWatts: 25, plateVolts: 400, method: 'direct', amps: 0.03125 })
      expect(out.watts).toBeCloseTo(12.5, 12)
      expect(out.percent).toBeCloseTo(50, 12)
      expect(out.band).toBe('in range')
    })

    it('sense resistor reads cathode current: the default 5 % screen share comes off', () => {
      // Source: Kirchhoff's current law (cathode = plate + screen); 5 % default is common practice, no source
      const out = computeTool('idle-dissipation', {
        mode: 'fixed', maxPlateWatts: 30, plateVolts: 450, method: 'sense-resistor', senseVolts: 0.040, senseOhms: 1,
      })
      expect(out.cathodeAmpsPerTube).toBeCloseTo(0.040, 12)
      expect(out.plateAmps).toBeCloseTo(0.038, 12)
      expect(out.plateToCathodeVolts).toBeCloseTo(450 - 0.040, 12)
      expect(out.watts).toBeCloseTo((450 - 0.04) * 0.038, 12)
    })

    it('cathode resistor: 330 Ω, 28.3 V, two 14 W tubes at 400 V, 10 % screen share is over 100 %', () => {
      // common practice, no source
      const out = computeTool('idle-dissipation', {
        mode: 'cathode', maxPlateWatts: 14, plateVolts: 400, method: 'cathode-resistor',
        cathodeVolts: 28.3, cathodeOhms: 330, tubesSharing: 2, screenFraction: 0.1,
      })
      expect(out.plateToCathodeVolts).toBeCloseTo(371.7, 9)
      expect(out.cathodeAmpsPerTube).toBeCloseTo(28.3 / 330 / 2, 12)
      expect(out.percent).toBeGreaterThan(100)
      expect(out.percent).toBeLessThan(105)
      expect(out.band).toBe('over')
    })

    it('drop across the half primary is plate current: no screen share taken off', () => {
      // common practice, no source (41 Ω half primary, 450 V, 70 % of 25 W: 38.9 mA, 1.59 V)
      const out = computeTool('idle-dissipation', {
        mode: 'fixed', maxPlateWatts: 25, plateVolts: 450, method: 'primary-drop',
        dropVolts: 41 * (17.5 / 450), halfPrimaryOhms: 41,
      })
      expect(out.plateAmps * 1000).toBeCloseTo(38.9, 1)
      expect(out.percent).toBeCloseTo(70, 9)
      expect(out.band).toBe('in range')
    })

    it('uses a shop’s own band thresholds', () => {
      const out = computeTool('idle-dissipation', {
        ...SAMPLES['idle-dissipation'], bandThresholds: { inRangeFrom: 60, inRangeTo: 75, overAbove: 100 },
      })
      expect(out.band).toBe('in range')
      expect(out.inRangeAmps.max).toBeCloseTo(0.75 * 14 / 285, 12)
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
      const parsed = parseToolInputs('idle-dissipation', {
        mode: 'cathode', maxPlateWatts: 12, plateVolts: 300, method: 'cathode-resistor',
        cathodeVolts: 10, cathodeOhms: 130, tubesSharing: 2,
      })
      expect(parsed).toMatchObject({ screenFraction: 0.05 })
    })
  })

  describe('cathode-resistor', () => {
    it('EL84 pair at 10.4 V and 40 mA each: 130 Ω (E24 130, E12 120), 0.83 W, and 25 µF for a 48.97 Hz corner', () => {
      // Source: Philips EL84 data (recalled from memory)
      const out = computeTool('cathode-resistor', SAMPLES['cathode-resistor'])
      expect(out.ohms).toBeCloseTo(130, 9)
      expect(out.nearestE24).toBe(130)
      expect(out.nearestE12).toBe(120)
      expect(out.watts).toBeCloseTo(0.83, 2)
      // common practice, no source (rating at twice the dissipation)
      expect(out.minRatingWatts).toBeCloseTo(2 * out.watts, 12)
      // Source: RC high-pass corner
      expect(out.bypassFarads).toBeCloseTo(25e-6, 9)
      expect(out.plateAmpsPerTube).toBeUndefined()
    })

    it('from a target percent: two 14 W tubes, 400 V, 28.3 V at the cathode, 100 %, 10 % screen: about 330 Ω', () => {
      // common practice, no source
      const out = computeTool('cathode-resistor', {
        target: 'percent', percent: 100, plateVolts: 400, maxPlateWatts: 14, screenFraction: 0.1,
        cathodeVolts: 28.3, tubesSharing: 2,
      })
      expect(out.plateAmpsPerTube).toBeCloseTo(14 / 371.7, 12)
      expect(out.cathodeAmpsPerTube).toBeCloseTo(14 / 371.7 / 0.9, 12)
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
      // Source: half-wave peak; voltage divider rule
      const out = computeTool('bias-supply', SAMPLES['bias-supply'])
      expect(out.dcVolts).toBeCloseTo(-70.0, 1)
      expect(out.leastNegativeVolts).toBeCloseTo(out.dcVolts * 0.3, 12)
      expect(out.mostNegativeVolts).toBeCloseTo(out.dcVolts * 0.8, 12)
      expect(out.targetInside).toBe(true)
      expect(out.marginVolts).toBeCloseTo(-48 - out.mostNegativeVolts, 12)
    })

    it('a target beyond the range is outside with a negative margin', () => {
      // Source: half-wave peak; voltage divider rule
      const out = computeTool('bias-supply', { ...SAMPLES['bias-supply'], targetGridVolts: -60 })
      expect(out.targetInside).toBe(false)
      expect(out.marginVolts).toBeLessThan(0)
      const none = computeTool('bias-supply', { ...SAMPLES['bias-supply'], targetGridVolts: undefined })
      expect(none).not.toHaveProperty('targetInside')
    })

    it('rejects a positive grid target', () => {
      expect(() => computeTool('bias-supply', { ...SAMPLES['bias-supply'], targetGridVolts: 40 })).toThrow(new RangeError('targetGridVolts must be a negative number'))
    })
  })

  describe('clean-power', () => {
    it('33.2 Vpp then 38.4 Vpp into 8 Ω: about 17 W and 23 W, about 6 W and 1.26 dB apart', () => {
      // common practice, no source
      const out = computeTool('clean-power', SAMPLES['clean-power'])
      expect(Math.round(out.wattsA)).toBe(17)
      expect(Math.round(out.wattsB!)).toBe(23)
      expect(Math.round(out.differenceWatts!)).toBe(6)
      // Source: definition of the decibel, 10·log10(P2/P1)
      expect(out.differenceDb).toBeCloseTo(20 * Math.log10(38.4 / 33.2), 12)
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
      // Source: RC discharge law
      const out = computeTool('cap-drain', SAMPLES['cap-drain'])
      expect(out.drainSeconds).toBeCloseTo(2.20, 2)
      expect(out.energyJoules).toBeCloseTo(10.1, 1)
      expect(out.timeConstantSeconds).toBeCloseTo(1, 12)
      expect(out.voltsAfterSeconds).toBeCloseTo(450 * Math.exp(-5), 9)
    })

    it('rejects a target at or above the start', () => {
      expect(() => computeTool('cap-drain', { ...SAMPLES['cap-drain'], targetVolts: 450 })).toThrow(new RangeError('targetVolts must be below startVolts'))
      expect(() => computeTool('cap-drain', { ...SAMPLES['cap-drain'], seconds: -1 })).toThrow(/seconds/)
    })
  })

  describe('load-reflection', () => {
    it('8 kΩ:8 Ω with 16 Ω on the tap: ratio 31.62, 16 kΩ reflected, twice nominal is not yet flagged', () => {
      // Source: reflected impedance law
      const out = computeTool('load-reflection', SAMPLES['load-reflection'])
      expect(out.turnsRatio).toBeCloseTo(31.62, 2)
      expect(out.reflectedOhms).toBeCloseTo(16_000, 6)
      expect(out.mismatchRatio).toBeCloseTo(2, 12)
      // common practice, no source (flag beyond a factor of 2)
      expect(out.mismatch).toBe(false)
    })

    it('flags a 4 Ω speaker on the 16 Ω tap', () => {
      // Source: reflected impedance law; flag threshold is common practice, no source
      const out = computeTool('load-reflection', { primaryOhms: 8000, secondaryOhms: 16, speakerOhms: 4 })
      expect(out.reflectedOhms).toBeCloseTo(2000, 9)
      expect(out.mismatch).toBe(true)
    })
  })

  describe('rc-corner', () => {
    it('130 Ω with 25 µF: 48.97 Hz, and back', () => {
      // Source: RC high-pass corner
      expect(computeTool('rc-corner', SAMPLES['rc-corner']).hz).toBeCloseTo(48.97, 2)
      expect(computeTool('rc-corner', { solveFor: 'farads', ohms: 130, hz: 48.97 }).farads).toBeCloseTo(25e-6, 9)
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

describe('verifySavedResult', () => {
  const saved = <K extends BenchToolId>(tool: K) => ({
    tool,
    inputs: roundTrip(SAMPLES[tool]),
    outputs: roundTrip(computeTool(tool, SAMPLES[tool])),
    engineVersion: ENGINE_VERSION,
  })

  it.each([...BENCH_TOOL_IDS])('accepts untouched %s outputs after a JSON round trip', (tool) => {
    expect(verifySavedResult(saved(tool))).toEqual({ ok: true })
  })

  it('tolerates rounding noise far below 1e-9', () => {
    const s = saved('idle-dissipation')
    s.outputs.watts *= 1 + 1e-12
    expect(verifySavedResult(s)).toEqual({ ok: true })
  })

  it('refuses a tampered number, naming it', () => {
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
