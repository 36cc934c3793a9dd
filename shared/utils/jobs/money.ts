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
