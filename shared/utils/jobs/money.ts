// Money is integer minor units (cents) everywhere; never floats.

export interface PartLine { quantity: number, unitPriceCents: number }
export interface LabourLine { minutes: number, rateCents: number }

/** Round half away from zero to a whole cent. */
export function roundCents(value: number): number {
  if (!Number.isFinite(value)) throw new RangeError('amount must be a finite number')
  return Math.sign(value) * Math.round(Math.abs(value))
}

export const partTotalCents = (p: PartLine) => roundCents(p.quantity * p.unitPriceCents)
/** rateCents is per hour. */
export const labourTotalCents = (l: LabourLine) => roundCents((l.minutes * l.rateCents) / 60)

export interface Totals { partsCents: number, labourCents: number, subtotalCents: number, taxCents: number, totalCents: number }

/** taxRateBasisPoints: 1 % = 100 (so 8.25 % is 825), kept integer like money. */
export function invoiceTotals(parts: PartLine[], labour: LabourLine[], taxRateBasisPoints: number): Totals {
  if (!Number.isInteger(taxRateBasisPoints) || taxRateBasisPoints < 0) throw new RangeError('taxRateBasisPoints must be a whole number of at least 0')
  const partsCents = parts.reduce((s, p) => s + partTotalCents(p), 0)
  const labourCents = labour.reduce((s, l) => s + labourTotalCents(l), 0)
  const subtotalCents = partsCents + labourCents
  const taxCents = roundCents((subtotalCents * taxRateBasisPoints) / 10_000)
  return { partsCents, labourCents, subtotalCents, taxCents, totalCents: subtotalCents + taxCents }
}

export function formatMoney(cents: number, currency = 'USD', locale = 'en-US'): string {
  return new Intl.NumberFormat(locale, { style: 'currency', currency }).format(cents / 100)
}

/** The largest amount a money field takes, in cents (the record schemas' cap). */
export const MAX_MONEY_CENTS = 100_000_000

const GROUPED = /^\d{1,3}(?:[.,]\d{3})+$/

/**
 * Money as people type it, in either decimal convention: "89,50" and "89.50" are 8950;
 * "1,234.50" and "1.234,50" are 123450; "0,5" is 50. With both marks, the last one is the
 * decimal mark; a lone mark followed by exactly three digits ("1,234") groups thousands.
 * Throws a RangeError with a sentence for letters, negatives, empty text and more than two decimals.
 */
export function parseMoneyCents(text: string): number {
  const t = text.trim().replace(/^[$€£]\s*/, '').replace(/\s*[$€£]$/, '').replace(/[\s\u00a0\u202f']/g, '')
  if (!t) throw new RangeError('enter an amount, like 89.50')
  if (/^[-−]/.test(t) || /[-−]$/.test(t)) throw new RangeError('an amount cannot be negative')
  if (!/^[\d.,]+$/.test(t) || !/\d/.test(t)) throw new RangeError('use digits and one decimal mark, like 89.50 or 89,50')

  const lastDot = t.lastIndexOf('.')
  const lastComma = t.lastIndexOf(',')
  let whole = t
  let frac = ''
  if (lastDot >= 0 && lastComma >= 0) {
    const at = Math.max(lastDot, lastComma)
    whole = t.slice(0, at)
    frac = t.slice(at + 1)
    const group = t[at] === '.' ? ',' : '.'
    if (whole.includes(t[at]!) || !GROUPED.test(whole.replaceAll(group, ','))) throw new RangeError('that amount mixes its marks: write it like 1,234.50 or 1.234,50')
    whole = whole.replaceAll(group, '')
  }
  else if (lastDot >= 0 || lastComma >= 0) {
    const mark = lastDot >= 0 ? '.' : ','
    const pieces = t.split(mark)
    const grouped = GROUPED.test(t) && !/^0\d*$/.test(pieces[0]!)
    if (pieces.length > 2 || (grouped && pieces[1]!.length === 3)) {
      if (!grouped) throw new RangeError('that amount has too many decimal marks')
      whole = pieces.join('')
    }
    else {
      whole = pieces[0]!
      frac = pieces[1]!
    }
  }
  if (frac.length > 2) throw new RangeError('at most two decimals, like 89.50')
  if (!whole && !frac) throw new RangeError('enter an amount, like 89.50')
  const cents = Number(whole || '0') * 100 + Number(frac.padEnd(2, '0') || '0')
  if (!Number.isSafeInteger(cents) || cents > MAX_MONEY_CENTS) throw new RangeError(`at most ${formatMoney(MAX_MONEY_CENTS)}`)
  return cents
}

/** parseMoneyCents without the throw: the amount, or the sentence saying why not. */
export function readMoney(text: string): { ok: true, cents: number } | { ok: false, message: string } {
  try {
    return { ok: true, cents: parseMoneyCents(text) }
  }
  catch (e) {
    return { ok: false, message: (e as Error).message }
  }
}

/** Currencies a shop can bill in: all with two-digit minor units, as the cents model assumes. */
export const SHOP_CURRENCIES = ['usd', 'eur', 'gbp', 'cad', 'aud', 'nzd', 'chf', 'sek', 'nok', 'dkk'] as const

/**
 * A tax rate as typed ("8.25", "8,25 %") in basis points (hundredths of a percent), read with the
 * same decimal rules as money. Refuses more than 100 %.
 */
export function parseRateBasisPoints(text: string): number {
  const t = text.replace(/\s*%\s*$/, '')
  // No rate has a thousands group, so "8.125" is three decimals, not 8125.
  if (/[.,]\d{3,}$/.test(t.trim())) throw new RangeError('at most two decimals, like 8.25')
  const bp = parseMoneyCents(t)
  if (bp > 10_000) throw new RangeError('a tax rate is at most 100 %')
  return bp
}

/** Basis points as a person reads a rate: 825 -> "8.25 %". */
export const formatRate = (bp: number) => `${(bp / 100).toLocaleString('en-US', { maximumFractionDigits: 2 })} %`
