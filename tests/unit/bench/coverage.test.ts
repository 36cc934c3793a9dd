import { readdirSync, readFileSync } from 'node:fs'
import { fileURLToPath } from 'node:url'
import { describe, expect, it } from 'vitest'
import * as engine from '../../../shared/utils/bench/index'

// Every function the engine exports, with the outside sources its checks use. A new export fails the
// first test until it is listed here, and the last test fails until two sourced checks call it.
const CHECKED_AGAINST: Record<string, string[]> = {
  peakToPeakToRms: ['BENCH-MATH check values (14 W and 50 W into 8 Ω)', 'mathjs: RMS of a sampled sine'],
  rmsPower: ['BENCH-MATH check values', 'SOURCES.md bleeder example (0.92 W)', 'mathjs units'],
  cleanPowerFromPeakToPeak: ['BENCH-MATH check values', 'SOURCES.md 6V6GTA 14 W and 6L6GC 55 W', 'mathjs: mean power of a sampled sine'],
  powerRatioDb: ['definition of the bel (IEC 60027-3)', 'SOURCES.md 55 W over 14 W, by hand'],
  currentFromSenseResistor: ['SOURCES.md 6V6GTA 70 mA for two', 'SOURCES.md 6550A 150 mA for two', 'mathjs units'],
  currentFromPrimaryDrop: ['BENCH-MATH transformer-resistance value (common practice)', 'SOURCES.md 6550A 150 mA for two', 'mathjs units'],
  cathodeCurrentPerTube: ['BENCH-MATH EL84 130 Ω (recalled)', 'SOURCES.md 12AX7 −2 V, 1.2 mA', 'mathjs units'],
  plateCurrentFromCathode: ['BENCH-MATH EL84 36 + 4 mA (recalled)', 'Kirchhoff\'s current law', 'mathjs units'],
  plateDissipation: ['SOURCES.md 6V6GTA, KT66, 6550A and 12AX7 operating points', 'mathjs units'],
  dissipationPercent: ['SOURCES.md operating points against their ratings', 'mathjs units'],
  idleBand: ['BENCH-MATH band definitions (common practice)', 'SOURCES.md operating points'],
  requireBiasMode: ['BENCH-MATH mode definition', 'BENCH-MATH RangeError rule'],
  resolveIdleBandThresholds: ['BENCH-MATH band definitions (common practice)', 'a shop\'s own thresholds, by hand'],
  idleCurrentForPercent: ['BENCH-MATH transformer-resistance value (common practice)', 'SOURCES.md 6V6GTA backwards', 'mathjs units'],
  cathodeResistorFor: ['BENCH-MATH EL84 (recalled)', 'SOURCES.md 12AX7 bias', 'mathjs units'],
  nearestPreferred: ['IEC 60063 lists', 'SOURCES.md 12AX7 1667 Ω, by hand'],
  rcCornerHz: ['BENCH-MATH 130 Ω with 25 µF', 'SOURCES.md 12AX7 1667 Ω, by hand', 'mathjs: complex high-pass gain'],
  capacitanceForCorner: ['BENCH-MATH 130 Ω at 48.97 Hz', 'hand calculation (1 MΩ, 7.2 Hz)', 'mathjs: complex high-pass gain'],
  capVoltageAfter: ['RC discharge law (e⁻¹)', 'SOURCES.md bleeder example', 'mathjs: ODE solver'],
  capDrainSeconds: ['BENCH-MATH 10 kΩ, 2.20 s', 'SOURCES.md bleeder example, 48 s', 'mathjs: ODE solver'],
  capEnergyJoules: ['BENCH-MATH 10.1 J', 'hand calculation (40 µF at 500 V)', 'mathjs: ∫V dq and units'],
  reflectedImpedance: ['BENCH-MATH 8 kΩ : 8 Ω', 'SOURCES.md 6L6GC 5.6 kΩ', 'mathjs: ideal transformer in units'],
  turnsRatioForImpedances: ['BENCH-MATH 8 kΩ : 8 Ω', 'SOURCES.md 6L6GC 5.6 kΩ and 6V6GTA 8 kΩ', 'mathjs: ideal transformer in units'],
  biasSupplyRange: ['BENCH-MATH 50 Vrms tap', 'SOURCES.md 6L6GC −37 V and 6V6GTA −19 V', 'mathjs: sampled sine peak and divider in units'],
  withinTolerance: ['BENCH-MATH matched-set rule', 'SOURCES.md 6550A pair', 'mathjs: exact fractions'],
  sortIntoSets: ['BENCH-MATH sort definition', 'brute-force enumeration of every grouping'],
  setSpread: ['BENCH-MATH matched-set rule (40 and 42 mA)', 'mathjs: exact fractions', 'the sorter\'s own sets'],
  setMeanAmps: ['hand calculation (40 and 42 mA)', 'mathjs: exact fractions'],
  spreadAgrees: ['SOURCES.md 6550A pair', 'mathjs: exact fractions'],
  isBenchToolId: ['BENCH-MATH list of tools', 'procedure definitions'],
  parseToolInputs: ['BENCH-MATH 5 % screen-share default', 'BENCH-MATH RangeError rule'],
  computeTool: ['SOURCES.md operating points', 'BENCH-MATH check values, by hand'],
  verifySavedResult: ['DEVELOPERS.md: the server re-checks saved results', 'BENCH-MATH check values as inputs'],
}

const here = fileURLToPath(new URL('.', import.meta.url))
const testFiles = readdirSync(here).filter(f => f.endsWith('.test.ts') && f !== 'coverage.test.ts')

/** The it() blocks of every bench test file that carry a source comment. */
function sourcedBlocks(): string[] {
  return testFiles.flatMap(f => readFileSync(`${here}/${f}`, 'utf8').split(/\n(?=\s*it(?:\.each\([^)]*\))?\()/).slice(1))
    .filter(block => /\/\/ Source|common practice, no source/.test(block))
}

const exported = Object.entries(engine).filter(([, v]) => typeof v === 'function').map(([k]) => k).sort()

describe('engine checks', () => {
  it('lists every exported engine function', () => {
    expect(Object.keys(CHECKED_AGAINST).sort()).toEqual(exported)
  })

  it('names at least two outside sources for each', () => {
    for (const [name, sources] of Object.entries(CHECKED_AGAINST)) expect(new Set(sources).size, name).toBeGreaterThanOrEqual(2)
  })

  it.each(exported)('%s is called in at least two sourced checks, not counting rejections', (name) => {
    const calls = new RegExp(`\\b${name}\\(`)
    const blocks = sourcedBlocks().filter(b => b.split('\n').some(line => calls.test(line) && !line.includes('toThrow')))
    expect(blocks.length).toBeGreaterThanOrEqual(2)
  })
})
