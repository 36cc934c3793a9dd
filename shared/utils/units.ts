// Reads the quantities a tech types ("36 mA", "4k7", "0,7 V", "100u") into SI numbers,
// and writes SI numbers back with a sensible prefix. Framework-free: used by the app and tests.

export type Dimension = 'V' | 'A' | 'Ω' | 'F' | 'W' | 'Hz' | 's' | '%' | 'count'

interface UnitDef {
  symbol: string
  dimension: Dimension
  factor: number
  /** Extra spellings, compared case-insensitively. */
  aliases?: string[]
}

const MICRO = 'µ'

// Only the prefixes that make sense on the bench, so a wrong-case "MA" can only mean mA and
// nothing is ever read as mega-amps or millifarads.
const UNITS: UnitDef[] = [
  { symbol: 'mV', dimension: 'V', factor: 1e-3 },
  { symbol: 'V', dimension: 'V', factor: 1, aliases: ['volt', 'volts', 'vdc', 'vac'] },
  { symbol: 'kV', dimension: 'V', factor: 1e3 },
  { symbol: 'Vpp', dimension: 'V', factor: 1, aliases: ['vp-p', 'v p-p'] },
  { symbol: 'mVpp', dimension: 'V', factor: 1e-3 },
  { symbol: 'Vrms', dimension: 'V', factor: 1, aliases: ['v rms'] },
  { symbol: 'mVrms', dimension: 'V', factor: 1e-3 },
  { symbol: `${MICRO}A`, dimension: 'A', factor: 1e-6, aliases: ['ua', 'μa'] },
  { symbol: 'mA', dimension: 'A', factor: 1e-3 },
  { symbol: 'A', dimension: 'A', factor: 1, aliases: ['amp', 'amps'] },
  { symbol: 'Ω', dimension: 'Ω', factor: 1, aliases: ['ohm', 'ohms', 'r', '\u2126'] },
  { symbol: 'kΩ', dimension: 'Ω', factor: 1e3, aliases: ['k', 'kohm', 'kohms', 'k\u2126'] },
  { symbol: 'MΩ', dimension: 'Ω', factor: 1e6, aliases: ['meg', 'megohm', 'megohms', 'M\u2126'] },
  { symbol: 'pF', dimension: 'F', factor: 1e-12, aliases: ['p'] },
  { symbol: 'nF', dimension: 'F', factor: 1e-9, aliases: ['n'] },
  { symbol: `${MICRO}F`, dimension: 'F', factor: 1e-6, aliases: ['uf', 'μf', 'u', 'µ', 'μ', 'mfd'] },
  { symbol: 'F', dimension: 'F', factor: 1 },
  { symbol: 'mW', dimension: 'W', factor: 1e-3 },
  { symbol: 'W', dimension: 'W', factor: 1, aliases: ['watt', 'watts'] },
  { symbol: 'Hz', dimension: 'Hz', factor: 1 },
  { symbol: 'kHz', dimension: 'Hz', factor: 1e3 },
  { symbol: 'ms', dimension: 's', factor: 1e-3 },
  { symbol: 's', dimension: 's', factor: 1, aliases: ['sec', 'secs', 'second', 'seconds'] },
  { symbol: 'min', dimension: 's', factor: 60, aliases: ['mins', 'minute', 'minutes'] },
  { symbol: '%', dimension: '%', factor: 0.01, aliases: ['percent'] },
]

const DIMENSION_WORDS: Record<Dimension, string> = {
  'V': 'a voltage',
  'A': 'a current',
  'Ω': 'a resistance',
  'F': 'a capacitance',
  'W': 'a power',
  'Hz': 'a frequency',
  's': 'a time',
  '%': 'a percentage',
  'count': 'a plain number',
}

// Unit symbols are matched exactly first (so mV and MΩ keep their case), then by alias.
function findUnit(text: string, dimension?: Dimension): UnitDef | undefined {
  const pool = dimension ? UNITS.filter(u => u.dimension === dimension) : UNITS
  const exact = pool.find(u => u.symbol === text)
  if (exact) return exact
  const lower = text.toLowerCase()
  const alias = pool.find(u => u.aliases?.some(a => a.toLowerCase() === lower))
  if (alias) return alias
  // One unambiguous case-insensitive match ("ma", "HZ"); "mv" is fine, "m" alone is not a unit.
  const loose = pool.filter(u => u.symbol.toLowerCase() === lower)
  return loose.length === 1 ? loose[0] : undefined
}

export function unitSymbol(text: string): string | undefined {
  return findUnit(text)?.symbol
}

export type QuantityResult =
  | { ok: true, value: number, unit: string | null }
  | { ok: false, empty: boolean, error: string }

const NUMBER = /^([+-]?(?:\d+(?:[.,]\d*)?|[.,]\d+))(?:e([+-]?\d+))?\s*(.*)$/i
// Resistor and capacitor codes: 4k7, 2M2, 4n7, 2u2, 4R7, 1p5.
const CODE = /^([+-]?\d+)([kKMRrnpuµμ])(\d+)$/

const CODE_UNITS: Record<string, string> = { k: 'kΩ', K: 'kΩ', M: 'MΩ', R: 'Ω', r: 'Ω', n: 'nF', p: 'pF', u: `${MICRO}F`, µ: `${MICRO}F`, μ: `${MICRO}F` }

function toNumber(digits: string, exponent?: string): number {
  const n = Number(digits.replace(',', '.'))
  return exponent === undefined ? n : n * 10 ** Number(exponent)
}

/**
 * Reads "36 mA", "0,7V", "4k7", "100u"; a bare number takes `defaultUnit`.
 * With `dimension`, a unit of another kind is refused ("36 mV" in a current field).
 */
export function readQuantity(input: string, options: { defaultUnit?: string, dimension?: Dimension } = {}): QuantityResult {
  const text = input.trim().replace(/\s+/g, ' ')
  if (text === '') return { ok: false, empty: true, error: 'enter a value' }
  const { dimension } = options
  const code = CODE.exec(text)
  let value: number
  let unitText: string
  if (code) {
    const [, whole, mark, frac] = code as unknown as [string, string, string, string]
    value = toNumber(`${whole}.${frac}`)
    unitText = CODE_UNITS[mark] ?? mark
  }
  else {
    const m = NUMBER.exec(text)
    if (!m || (m[1]?.match(/,/g)?.length ?? 0) > 1) return { ok: false, empty: false, error: `"${input.trim()}" is not a number` }
    value = toNumber(m[1] as string, m[2])
    unitText = (m[3] ?? '').trim()
  }
  if (!Number.isFinite(value)) return { ok: false, empty: false, error: `"${input.trim()}" is not a number` }
  if (unitText === '') {
    const fallback = options.defaultUnit ? findUnit(options.defaultUnit, dimension) : undefined
    if (options.defaultUnit && !fallback && dimension !== 'count') {
      return { ok: false, empty: false, error: `unknown unit ${options.defaultUnit}` }
    }
    return { ok: true, value: value * (fallback?.factor ?? 1), unit: fallback?.symbol ?? null }
  }
  if (dimension === 'count') return { ok: false, empty: false, error: 'enter a plain number, without a unit' }
  const unit = findUnit(unitText, dimension)
  if (!unit) {
    const other = findUnit(unitText)
    return {
      ok: false,
      empty: false,
      error: other && dimension
        ? `${other.symbol} is ${DIMENSION_WORDS[other.dimension]}; this needs ${DIMENSION_WORDS[dimension]}`
        : `unknown unit "${unitText}"`,
    }
  }
  return { ok: true, value: value * unit.factor, unit: unit.symbol }
}

/** SI value of a typed quantity, or NaN when it cannot be read. */
export function parseQuantity(input: string, defaultUnit?: string): number {
  const r = readQuantity(input, { defaultUnit })
  return r.ok ? r.value : Number.NaN
}

const PREFIXED: Partial<Record<Dimension, { symbol: string, factor: number }[]>> = {
  'V': [{ symbol: 'kV', factor: 1e3 }, { symbol: 'V', factor: 1 }, { symbol: 'mV', factor: 1e-3 }],
  'A': [{ symbol: 'A', factor: 1 }, { symbol: 'mA', factor: 1e-3 }, { symbol: `${MICRO}A`, factor: 1e-6 }],
  'Ω': [{ symbol: 'MΩ', factor: 1e6 }, { symbol: 'kΩ', factor: 1e3 }, { symbol: 'Ω', factor: 1 }],
  'F': [{ symbol: 'F', factor: 1 }, { symbol: `${MICRO}F`, factor: 1e-6 }, { symbol: 'nF', factor: 1e-9 }, { symbol: 'pF', factor: 1e-12 }],
  'W': [{ symbol: 'kW', factor: 1e3 }, { symbol: 'W', factor: 1 }, { symbol: 'mW', factor: 1e-3 }],
  'Hz': [{ symbol: 'MHz', factor: 1e6 }, { symbol: 'kHz', factor: 1e3 }, { symbol: 'Hz', factor: 1 }],
  's': [{ symbol: 's', factor: 1 }, { symbol: 'ms', factor: 1e-3 }],
}

/** Three significant figures, no exponent; `trim` drops trailing zeros (for preferred values). */
export function formatNumber(value: number, options: { digits?: number, trim?: boolean } = {}): string {
  if (!Number.isFinite(value)) return '–'
  const digits = options.digits ?? 3
  const abs = Math.abs(value)
  // Magnitude after rounding, so 0.99999 shows as "1.00", not "1.000".
  const rounded = Number(abs.toPrecision(digits))
  const magnitude = rounded === 0 ? 0 : Math.floor(Math.log10(rounded))
  const decimals = Math.max(0, digits - 1 - magnitude)
  // Round half away from zero on the decimal value typed, not its binary neighbour (9.975 -> 9.98).
  const scaled = Number((abs * 10 ** decimals).toPrecision(12))
  let text = (Math.sign(value) * Math.round(scaled) / 10 ** decimals).toFixed(decimals)
  if (options.trim && text.includes('.')) text = text.replace(/\.?0+$/, '')
  return text.replace('-', '−')
}

/** "35.0 mA", "9.98 W", "4.70 kΩ": the prefix that keeps the number between 1 and 1000. */
export function formatQuantity(si: number, dimension: Dimension, options: { digits?: number, trim?: boolean, unit?: string } = {}): string {
  if (!Number.isFinite(si)) return '–'
  if (dimension === '%') return `${formatNumber(si * 100, { digits: options.digits ?? 3, trim: options.trim })} %`
  if (dimension === 'count') return formatNumber(si, options)
  const choices = PREFIXED[dimension] ?? [{ symbol: dimension, factor: 1 }]
  const fixed = options.unit ? choices.find(c => c.symbol === options.unit) : undefined
  const abs = Math.abs(si)
  const base = choices.find(c => c.factor === 1) ?? choices[0]!
  // 999.6 mA rounds to "1000 mA": pick the prefix after rounding.
  const fits = choices.find(c => Number(formatNumber(abs / c.factor, options)) >= 1)
  const pick = fixed ?? (si === 0 ? base : fits ?? choices[choices.length - 1]!)
  return `${formatNumber(si / pick.factor, options)} ${pick.symbol}`
}
