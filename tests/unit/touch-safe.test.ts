import { describe, expect, it } from 'vitest'
import { computeTool } from '../../shared/utils/bench/index'
import { expandSteps, findProcedure, holdSeconds } from '../../shared/utils/procedures/index'
import { DRAIN_HOLD_MIN_SECONDS, RECHECK_HOLD_SECONDS, TOUCH_SAFE_SHORT, TOUCH_SAFE_VOLTS, TOUCH_SAFE_WHY } from '../../shared/utils/procedures/touch-safe'

const caps = findProcedure('drain-and-verify-caps')!
const step = (id: string) => caps.steps.find(s => s.id === id)!

describe('the touch-safe threshold', () => {
  it('is 50 V and cites the US workplace rule, conservative against the IEC figures', () => {
    // Source: SOURCES.md, "Touch-safe and discharge thresholds": OSHA 29 CFR 1910.333(a) and NFPA 70E, 50 V;
    // IEC 61140:2016 ELV band, 120 V ripple-free d.c.; IEC 62368-1 ES1, 60 V d.c. (memory)
    expect(TOUCH_SAFE_VOLTS).toBe(50)
    expect(TOUCH_SAFE_VOLTS).toBeLessThan(60)
    expect(TOUCH_SAFE_VOLTS).toBeLessThan(120)
    expect(TOUCH_SAFE_WHY).toMatch(/OSHA 29 CFR 1910\.333\(a\)/)
    expect(TOUCH_SAFE_WHY).toMatch(/NFPA 70E/)
    expect(TOUCH_SAFE_WHY).toMatch(/conservative against IEC 61140.*120 V ripple-free d\.c\./)
    expect(TOUCH_SAFE_WHY).toMatch(/IEC 62368-1's 60 V/)
    expect(TOUCH_SAFE_WHY).toMatch(/No rule written for servicing tube amplifiers was found/)
    expect(TOUCH_SAFE_WHY).toMatch(/local codes and licensed practice/)
    expect(TOUCH_SAFE_SHORT).toMatch(/50 V.*60 V.*120 V.*Local codes/)
  })

  it('is the limit the drain procedure checks, with its reason shown before the reading', () => {
    // Source: SOURCES.md, as above
    for (const id of ['verify', 'recheck']) expect(step(id).expect?.max).toBe(TOUCH_SAFE_VOLTS)
    expect(step('verify').caution).toEqual({ level: 'danger', text: `Touch only at 50 V or less. ${TOUCH_SAFE_WHY}` })
  })
})

describe('the drain procedure\'s hold times', () => {
  it('say where they come from: common practice, no source', () => {
    // common practice, no source (SOURCES.md: no rule written for servicing tube amplifiers was found)
    expect(step('drain').hold).toMatchObject({ seconds: DRAIN_HOLD_MIN_SECONDS, fromStep: 'drain-time' })
    expect(step('drain').hold!.reason).toMatch(/common practice, no source/)
    expect(step('recheck').hold).toMatchObject({ seconds: RECHECK_HOLD_SECONDS })
    expect(step('recheck').hold!.reason).toMatch(/^Wait 1 minute .*common practice, no source/)
  })

  it('hold the drain resistor on for the bleeder example\'s 48 s, not the 10 s minimum', () => {
    // Source: SOURCES.md, V = V0·e^(−t/RC): 220 kΩ across 100 µF, τ = 22 s, about 48 s from 450 V to 50 V.
    // By hand: t = 22 s × ln(450 / 50) = 22 × 2.19722 = 48.339 s, so the hold rounds up to 49 s.
    const out = computeTool('cap-drain', { farads: 100e-6, startVolts: 450, targetVolts: TOUCH_SAFE_VOLTS, ohms: 220_000 })
    expect(out.timeConstantSeconds).toBeCloseTo(22, 9)
    expect(out.drainSeconds).toBeCloseTo(48.339, 3)
    const drain = expandSteps(caps, '', { tubes: 2, caps: 2 }).find(s => s.key === 'drain')!
    expect(holdSeconds(drain, { 'drain-time': { value: out.drainSeconds, at: '2026-12-02T12:00:00.000Z' } })).toBe(49)
  })
})
