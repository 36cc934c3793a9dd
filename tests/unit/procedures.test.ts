import { describe, expect, it } from 'vitest'
import { computeTool, isBenchToolId, parseToolInputs } from '../../shared/utils/bench/index'
import type { BenchToolId } from '../../shared/utils/bench/index'
import {
  GATE, PROCEDURES, checkRange, evaluateRun, expandSteps, findProcedure, gateComplete, holdSeconds, mayRun, needsValue, readOutput, toolPresets, validVariant,
} from '../../shared/utils/procedures/index'
import type { StepReading } from '../../shared/utils/procedures/index'
import { ROLES } from '../../shared/utils/roles'

// One valid input per tool, to prove each recorded output exists.
const SAMPLE: Record<BenchToolId, unknown> = {
  'idle-dissipation': { mode: 'fixed', maxPlateWatts: 14, plateVolts: 400, method: 'sense-resistor', senseVolts: 0.028, senseOhms: 1 },
  'cathode-resistor': { target: 'current', cathodeVolts: 10, cathodeAmpsPerTube: 0.04, tubesSharing: 2 },
  'bias-supply': { tapVoltsRms: 50, diodeDropVolts: 0.7, topOhms: 10_000, potOhms: 25_000, bottomOhms: 15_000 },
  'clean-power': { loadOhms: 8, readingA: { kind: 'vpp', volts: 33.2 } },
  'cap-drain': { farads: 220e-6, startVolts: 450, targetVolts: 50, ohms: 100_000 },
  'load-reflection': { primaryOhms: 8000, secondaryOhms: 8, speakerOhms: 8 },
  'rc-corner': { solveFor: 'hz', ohms: 130, farads: 25e-6 },
  'tube-sorter': { readings: [{ id: 'a', amps: 0.030 }, { id: 'b', amps: 0.0305 }], setSize: 2, tolerance: 0.05 },
}

const at = '2026-12-02T10:00:00.000Z'
const counts = { tubes: 2, caps: 3 }

describe('procedure definitions', () => {
  it('have unique ids and include the five bench procedures and the backstage check', () => {
    const ids = PROCEDURES.map(p => p.id)
    expect(new Set(ids).size).toBe(ids.length)
    expect(ids).toEqual(expect.arrayContaining(['set-fixed-bias', 'check-cathode-bias', 'retube-and-sort', 'clean-power-run', 'drain-and-verify-caps', 'backstage-check']))
    expect(findProcedure('no-such-thing')).toBeUndefined()
  })

  for (const p of PROCEDURES) {
    describe(p.title, () => {
      it('has a gate whose items are unique, worded, and end with local codes', () => {
        expect(p.gate.length).toBeGreaterThanOrEqual(3)
        expect(new Set(p.gate.map(g => g.id)).size).toBe(p.gate.length)
        for (const g of p.gate) expect(g.text.length).toBeGreaterThan(20)
        expect(p.gate.at(-1)).toEqual(GATE.localCodes)
      })

      it('has valid steps: unique ids, something to do, existing tools and outputs, sane ranges and holds', () => {
        const ids = p.steps.map(s => s.id)
        expect(new Set(ids).size).toBe(ids.length)
        const variants = new Set((p.variants ?? []).map(v => v.id))
        p.steps.forEach((s, i) => {
          const earlier = p.steps.slice(0, i)
          expect(s.instruction.length, s.id).toBeGreaterThan(20)
          // Each step is marked done by a confirmation, a typed reading or a tool result.
          expect([!!s.confirm, !!s.reading, !!s.tool].filter(Boolean).length, s.id).toBe(1)
          if (s.only) expect(variants.has(s.only), s.id).toBe(true)
          if (s.tool) {
            expect(isBenchToolId(s.tool.id), s.id).toBe(true)
            const out = computeTool(s.tool.id, SAMPLE[s.tool.id])
            expect(readOutput(out, s.tool.record.output), `${s.id} records ${s.tool.record.output}`).toBeTypeOf('number')
            for (const from of Object.values(s.tool.fromReadings ?? {})) {
              expect(earlier.find(e => e.id === from)?.reading, `${s.id} fills from ${from}`).toBeDefined()
            }
            for (const v of Object.keys(s.tool.variantPresets ?? {})) expect(variants.has(v)).toBe(true)
          }
          if (s.expect) {
            expect(s.tool || s.reading, `${s.id} has a range but no reading`).toBeTruthy()
            const { min, max, reason } = s.expect
            expect(min !== undefined || max !== undefined).toBe(true)
            for (const v of [min, max]) if (v !== undefined) expect(Number.isFinite(v)).toBe(true)
            if (min !== undefined && max !== undefined) expect(min).toBeLessThan(max)
            expect(reason.length).toBeGreaterThan(20)
          }
          if (s.hold) {
            expect(s.hold.seconds).toBeGreaterThan(0)
            expect(s.hold.seconds).toBeLessThanOrEqual(600)
            if (s.hold.fromStep) {
              const from = earlier.find(e => e.id === s.hold!.fromStep)
              expect(from?.tool?.record.dimension ?? from?.reading?.dimension, `${s.id} holds from ${s.hold.fromStep}`).toBe('s')
            }
          }
        })
      })
    })
  }
})

describe('who may run what', () => {
  it('players run only what stays outside the chassis; desk runs nothing; techs and owners run everything', () => {
    for (const p of PROCEDURES) {
      expect(mayRun(p, 'player'), p.id).toBe(!p.insideChassis)
      expect(mayRun(p, 'desk'), p.id).toBe(false)
      expect(mayRun(p, 'tech'), p.id).toBe(true)
      expect(mayRun(p, 'owner'), p.id).toBe(true)
    }
    expect(PROCEDURES.filter(p => !p.insideChassis).map(p => p.id)).toEqual(['backstage-check'])
    expect(ROLES).toHaveLength(4)
  })
})

describe('expandSteps', () => {
  const bias = findProcedure('set-fixed-bias')!
  it('repeats the per-tube steps and leaves out the other method', () => {
    const keys = expandSteps(bias, 'sense-resistor', { tubes: 4, caps: 1 }).map(s => s.key)
    expect(keys.filter(k => k.startsWith('measure-final:'))).toEqual(['measure-final:1', 'measure-final:2', 'measure-final:3', 'measure-final:4'])
    expect(keys.some(k => k.startsWith('primary-resistance'))).toBe(false)
    const transformer = expandSteps(bias, 'transformer-resistance', { tubes: 2, caps: 1 })
    expect(transformer.map(s => s.key)).toContain('primary-resistance:2')
    expect(transformer.find(s => s.key === 'measure-initial:2')?.heading).toBe('Measure the idle current: tube 2 of 2')
  })

  it('defaults to the first variant, and checks a variant belongs to the procedure', () => {
    expect(expandSteps(bias, '', counts).map(s => s.key)).toEqual(expandSteps(bias, 'sense-resistor', counts).map(s => s.key))
    expect(validVariant(bias, 'sense-resistor')).toBe(true)
    expect(validVariant(bias, 'shunt')).toBe(false)
    expect(validVariant(bias, '')).toBe(true)
    expect(validVariant(findProcedure('backstage-check')!, '')).toBe(true)
    expect(validVariant(findProcedure('backstage-check')!, 'sense-resistor')).toBe(false)
  })
})

describe('the safety gate', () => {
  const caps = findProcedure('drain-and-verify-caps')!
  const all = caps.gate.map(g => g.id)
  it('is complete only when every item is ticked, and only its own items', () => {
    expect(gateComplete(caps, all)).toBe(true)
    expect(gateComplete(caps, all.slice(1))).toBe(false)
    expect(gateComplete(caps, [])).toBe(false)
    expect(gateComplete(caps, [...all, 'something-else'])).toBe(false)
  })
})

describe('readings against their ranges', () => {
  const bias = findProcedure('set-fixed-bias')!
  const final = expandSteps(bias, 'sense-resistor', counts).find(s => s.key === 'measure-final:1')!

  it('a 6V6 at 400 V reading 28 mV across 1 Ω idles at 76 % of 14 W: outside 50–70 %, so the run stops', () => {
    const out = computeTool('idle-dissipation', parseToolInputs('idle-dissipation', SAMPLE['idle-dissipation']))
    // Source: Ohm's law I = V/R (28 mA cathode), 5 % screen share off (common practice, no source),
    // P = V·I = (400 − 0.028) V × 26.6 mA = 10.64 W; 10.64 / 14 = 76.0 %. 14 W is the 6V6GTA design-maximum (SOURCES.md: a build write-up's table, S2).
    const value = readOutput(out, final.tool!.record.output)! * final.tool!.record.factor!
    expect(value).toBeCloseTo(0.76, 3)
    const verdict = checkRange(final.expect, value)
    expect(verdict).toEqual({ ok: false, side: 'high', reason: final.expect!.reason })
    // 20 mV across 1 Ω: 19 mA × 400 V = 7.6 W = 54 % of 14 W (Source: P = V·I), inside the band.
    const cooler = computeTool('idle-dissipation', { ...(SAMPLE['idle-dissipation'] as object), senseVolts: 0.020 })
    expect(checkRange(final.expect, cooler.percent / 100)).toEqual({ ok: true })
  })

  it('a capacitor above 50 V blocks finishing the drain procedure; at or below it, it finishes', () => {
    const caps = findProcedure('drain-and-verify-caps')!
    const steps = expandSteps(caps, '', counts)
    const done: Record<string, StepReading> = Object.fromEntries(steps.map(s => [s.key, needsValue(s) ? { value: 3, at } : { at }]))
    done['drain-time'] = { value: 48.3, at }
    expect(evaluateRun(caps, '', counts, done).canFinish).toBe(true)
    // Source: the 50 V touch-safe threshold (SOURCES.md: OSHA 29 CFR 1910.333(a) and NFPA 70E, 50 V;
    // conservative against IEC 61140's 120 V ripple-free d.c. and IEC 62368-1's 60 V); any capacitor above it blocks "done".
    const hot = { ...done, 'verify:2': { value: 51, at } }
    const e = evaluateRun(caps, '', counts, hot)
    expect(e.canFinish).toBe(false)
    expect(e.outOfRange.map(o => o.step.key)).toEqual(['verify:2'])
    expect(evaluateRun(caps, '', counts, { ...done, 'verify:2': { value: 50, at } }).canFinish).toBe(true)
  })

  it('a step with no reading, or a reading step with no value, keeps the run open', () => {
    const back = findProcedure('backstage-check')!
    const steps = expandSteps(back, '', counts)
    const all = Object.fromEntries(steps.map(s => [s.key, { at }]))
    expect(evaluateRun(back, '', counts, all).canFinish).toBe(true)
    const { fuses: _f, ...rest } = all
    expect(evaluateRun(back, '', counts, rest).missing.map(s => s.key)).toEqual(['fuses'])
    const caps = findProcedure('drain-and-verify-caps')!
    const noValue = Object.fromEntries(expandSteps(caps, '', counts).map(s => [s.key, { at }]))
    expect(evaluateRun(caps, '', counts, noValue).missing.map(s => s.key)).toEqual(['drain-time', 'verify:1', 'verify:2', 'verify:3', 'recheck'])
  })
})

describe('holds', () => {
  it('the drain hold lasts the computed drain time when that is longer than its own minimum', () => {
    const caps = findProcedure('drain-and-verify-caps')!
    const drain = expandSteps(caps, '', counts).find(s => s.key === 'drain')!
    const out = computeTool('cap-drain', SAMPLE['cap-drain'])
    // Source: RC discharge V(t) = V0·e^(−t/RC): t = RC·ln(V0/V) = 22 s × ln(450/50) = 48.34 s.
    expect(out.drainSeconds).toBeCloseTo(22 * Math.log(9), 6)
    expect(holdSeconds(drain, { 'drain-time': { value: out.drainSeconds, at } })).toBe(49)
    expect(holdSeconds(drain, { 'drain-time': { value: 2.2, at } })).toBe(drain.hold!.seconds)
    expect(holdSeconds(drain, {})).toBe(drain.hold!.seconds)
  })
})

describe('readOutput', () => {
  it('reads a key or a list length, and nothing else', () => {
    expect(readOutput({ percent: 61.2 }, 'percent')).toBe(61.2)
    expect(readOutput({ sets: [{}, {}] }, 'sets.length')).toBe(2)
    expect(readOutput({ band: 'warm' }, 'band')).toBeUndefined()
    expect(readOutput(null, 'percent')).toBeUndefined()
  })
})

describe('toolPresets', () => {
  const bias = findProcedure('set-fixed-bias')!
  it('sets the method for the variant, empties the last tube\'s reading and carries the half-primary resistance of the same tube', () => {
    const steps = expandSteps(bias, 'transformer-resistance', counts)
    const tube2 = steps.find(s => s.key === 'measure-initial:2')!
    const readings = { 'primary-resistance:1': { value: 105, at }, 'primary-resistance:2': { value: 112, at } }
    expect(toolPresets(bias, tube2, 'transformer-resistance', readings)).toEqual({
      mode: 'fixed', method: 'primary-drop', senseVolts: '', dropVolts: '', halfPrimaryOhms: '112', halfPrimaryOhmsUnit: 'Ω',
    })
    const sense = expandSteps(bias, 'sense-resistor', counts).find(s => s.key === 'measure-initial:1')!
    expect(toolPresets(bias, sense, 'sense-resistor', {})).toEqual({ mode: 'fixed', method: 'sense-resistor', senseVolts: '', dropVolts: '' })
  })
})
