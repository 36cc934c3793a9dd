import { describe, expect, it } from 'vitest'
import { computeTool } from '../../shared/utils/bench'
import { si, sig, summarize, toolName } from '../../app/utils/notebook/measurement-summary'

describe('saved result summaries', () => {
  it('writes values with SI prefixes', () => {
    expect(si(1500, 'Ω')).toBe('1.5 kΩ')
    expect(si(0.000047, 'F')).toBe('47 µF')
    expect(si(220, 'Ω')).toBe('220 Ω')
    expect(si(999.9, 'Ω')).toBe('1 kΩ')
    expect(sig(12.3456)).toBe('12.3')
  })

  it('shows watts, percent of rating and the band for idle dissipation', () => {
    // Source: P = V × I (definition of electric power): (420 V − 0 V) × 0.05 A = 21 W; 21 / 30 = 70 %.
    const out = computeTool('idle-dissipation', { method: 'direct', mode: 'fixed', plateVolts: 420, amps: 0.05, maxPlateWatts: 30 })
    // 70 % is the top of the fixed-bias in-range band (common practice, no source).
    expect(summarize('idle-dissipation', out)).toEqual({ headline: '21 W · 70 % of rating', band: 'in range' })
    expect(toolName('idle-dissipation')).toBe('Idle dissipation')
  })

  it('shows clean power from an RMS reading', () => {
    // Source: P = V² / R: (20 V)² / 8 Ω = 50 W.
    const out = computeTool('clean-power', { loadOhms: 8, readingA: { kind: 'vrms', volts: 20 } })
    expect(summarize('clean-power', out).headline).toBe('50 W')
  })

  it('shows the RC corner frequency with its capacitor', () => {
    // Source: f = 1 / (2π R C): 1 / (2π × 1 kΩ × 1 µF) = 159.15 Hz.
    const out = computeTool('rc-corner', { solveFor: 'hz', ohms: 1000, farads: 1e-6 })
    expect(summarize('rc-corner', out).headline).toBe('159 Hz with 1 µF')
  })

  it('reads unknown or damaged outputs without throwing', () => {
    expect(summarize('idle-dissipation', null).headline).toBe('– W · – % of rating')
    expect(summarize('not-a-tool', {}).headline).toBe('Saved result')
  })
})
