// How a saved bench result reads in a list: the tool's name and its key result, with units.
import type { BenchToolId, IdleBand } from '#shared/utils/bench'

export const TOOL_NAMES: Record<BenchToolId, string> = {
  'idle-dissipation': 'Idle dissipation',
  'cathode-resistor': 'Cathode resistor',
  'bias-supply': 'Bias supply',
  'clean-power': 'Clean power',
  'cap-drain': 'Cap drain',
  'load-reflection': 'Load reflection',
  'rc-corner': 'RC corner',
  'tube-sorter': 'Tube sorter',
}

export const toolName = (tool: string) => TOOL_NAMES[tool as BenchToolId] ?? tool

const PREFIXES: [number, string][] = [[1e6, 'M'], [1e3, 'k'], [1, ''], [1e-3, 'm'], [1e-6, 'µ'], [1e-9, 'n'], [1e-12, 'p']]

/** Three significant figures, no exponent. */
export function sig(n: number, digits = 3): string {
  if (!Number.isFinite(n)) return '–'
  return Number(n.toPrecision(digits)).toLocaleString('en-GB', { maximumFractionDigits: 12 })
}

/** A value with an SI prefix: 1500 Ω → "1.5 kΩ", 0.000047 F → "47 µF". */
export function si(n: number, unit: string): string {
  if (!Number.isFinite(n)) return `– ${unit}`
  const abs = Math.abs(n)
  const [scale, prefix] = PREFIXES.find(([s]) => abs >= s * 0.9995) ?? PREFIXES[PREFIXES.length - 1]!
  return `${sig(n / scale)} ${prefix}${unit}`
}

export interface MeasurementSummary { headline: string, band?: IdleBand }

type Out = Record<string, unknown>
const num = (o: Out, k: string) => (typeof o[k] === 'number' ? (o[k] as number) : Number.NaN)
const BANDS: readonly IdleBand[] = ['cold', 'in range', 'warm', 'over']

export function summarize(tool: string, outputs: unknown): MeasurementSummary {
  const o = (outputs && typeof outputs === 'object' ? outputs : {}) as Out
  switch (tool) {
    case 'idle-dissipation': {
      const band = BANDS.find(b => b === o.band)
      return { headline: `${sig(num(o, 'watts'))} W · ${sig(num(o, 'percent'), 2)} % of rating`, ...(band ? { band } : {}) }
    }
    case 'cathode-resistor':
      return { headline: `${si(num(o, 'ohms'), 'Ω')} (nearest E12 ${si(num(o, 'nearestE12'), 'Ω')}) · rate it ${sig(num(o, 'minRatingWatts'))} W or more` }
    case 'bias-supply':
      return { headline: `${sig(num(o, 'mostNegativeVolts'))} V to ${sig(num(o, 'leastNegativeVolts'))} V${o.targetInside === false ? ' · target outside the range' : ''}` }
    case 'clean-power':
      return { headline: typeof o.wattsB === 'number' ? `${sig(num(o, 'wattsA'))} W → ${sig(num(o, 'wattsB'))} W` : `${sig(num(o, 'wattsA'))} W` }
    case 'cap-drain':
      return { headline: `${sig(num(o, 'energyJoules'))} J stored · ${sig(num(o, 'drainSeconds'))} s to drain` }
    case 'load-reflection':
      return { headline: `${si(num(o, 'reflectedOhms'), 'Ω')} reflected${o.mismatch === true ? ' · mismatched' : ''}` }
    case 'rc-corner':
      return { headline: `${si(num(o, 'hz'), 'Hz')} with ${si(num(o, 'farads'), 'F')}` }
    case 'tube-sorter': {
      const sets = Array.isArray(o.sets) ? o.sets.length : 0
      const left = Array.isArray(o.unmatched) ? o.unmatched.length : 0
      return { headline: `${sets} matched ${sets === 1 ? 'set' : 'sets'}, ${left} left over` }
    }
  }
  return { headline: 'Saved result' }
}
