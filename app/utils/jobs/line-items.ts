// Parts and labour on a job: one description of each kind of line, read and checked the same way.
import { formatMoney, labourTotalCents, partTotalCents, readMoney } from '../../../shared/utils/jobs/money'
import type { JobLabourRecord, JobPartRecord } from '../../../shared/types/records'
import { validateCreate, type FieldErrors } from './check-in'

export interface LineField {
  /** The record field it fills (and the key of its message). */
  key: string
  /** The input's id (tests and labels use it). */
  id: string
  label: string
  hint?: string
  input: 'text' | 'number' | 'money'
  placeholder?: string
  wide?: boolean
  /** Numbers: what to say when the text is not one more than 0. */
  problem?: string
  whole?: boolean
  /** Money: an empty field reads as nothing owed. */
  optional?: boolean
  /** Kept after a line is added (a rate is usually the same for the next line). */
  keep?: boolean
  /** The text the field starts with. */
  initial?: string
}

export interface LineShown { id: string, title: string, detail: string, totalCents: number, removeLabel: string }

interface LineKind<R> {
  table: 'jobParts' | 'jobLabour'
  heading: string
  empty: string
  submit: string
  fields: LineField[]
  show: (row: R, currency: string) => LineShown
}

const PART: LineKind<JobPartRecord> = {
  table: 'jobParts',
  heading: 'Parts and tubes',
  empty: 'No parts yet.',
  submit: 'Add part',
  fields: [
    { key: 'description', id: 'part-description', label: 'Part', input: 'text', placeholder: 'e.g. matched pair 6V6GT', wide: true },
    { key: 'quantity', id: 'part-quantity', label: 'Quantity', input: 'number', problem: 'more than 0', initial: '1' },
    { key: 'unitCostCents', id: 'part-cost', label: 'Unit cost', hint: 'optional', input: 'money', optional: true },
    { key: 'unitPriceCents', id: 'part-price', label: 'Unit price', input: 'money' },
  ],
  show: (p, currency) => ({
    id: p.id,
    title: p.description,
    detail: `${p.quantity} × ${formatMoney(p.unitPriceCents, currency)}`,
    totalCents: partTotalCents(p),
    removeLabel: `Remove ${p.description}`,
  }),
}

const LABOUR: LineKind<JobLabourRecord> = {
  table: 'jobLabour',
  heading: 'Labour',
  empty: 'No labour booked yet.',
  submit: 'Add labour',
  fields: [
    { key: 'description', id: 'labour-description', label: 'Work', hint: 'optional', input: 'text', placeholder: 'e.g. set bias, soak test', wide: true },
    { key: 'minutes', id: 'labour-minutes', label: 'Minutes', input: 'number', problem: 'whole minutes, more than 0', whole: true },
    { key: 'rateCents', id: 'labour-rate', label: 'Rate per hour', input: 'money', keep: true },
  ],
  show: (l, currency) => ({
    id: l.id,
    title: l.description || 'Bench time',
    detail: `${l.minutes} min at ${formatMoney(l.rateCents, currency)}/h`,
    totalCents: labourTotalCents(l),
    removeLabel: 'Remove this labour line',
  }),
}

export const LINE_KINDS = { part: PART, labour: LABOUR }
export type LineKindName = keyof typeof LINE_KINDS

/** The form's texts as they start, or after a line was added (`kept` from the last one). */
export function blankLine(kind: LineKindName, kept: Record<string, string> = {}) {
  return Object.fromEntries(LINE_KINDS[kind].fields.map(f => [f.key, (f.keep ? kept[f.key] : undefined) ?? f.initial ?? '']))
}

/** A stored line as the list shows it. */
export const showLine = (kind: LineKindName, row: JobPartRecord | JobLabourRecord, currency: string) =>
  (LINE_KINDS[kind].show as (r: typeof row, c: string) => LineShown)(row, currency)

function readField(f: LineField, text: string): { value: unknown } | { error: string } {
  if (f.input === 'text') return { value: text }
  if (f.input === 'money') {
    if (!text && f.optional) return { value: 0 }
    const m = readMoney(text)
    return m.ok ? { value: m.cents } : { error: m.message }
  }
  const n = Number(text.replace(',', '.'))
  return text && n > 0 && (!f.whole || Number.isInteger(n)) ? { value: n } : { error: f.problem ?? 'enter a number' }
}

/**
 * The typed texts as a line's fields: each text read as its kind (money either decimal mark), then
 * the whole line checked with the record schema the server applies. Errors are keyed by field.
 */
export function readLine(kind: LineKindName, form: Record<string, string>, extra: Record<string, unknown>) {
  const errors: FieldErrors = {}
  const fields: Record<string, unknown> = { ...extra }
  for (const f of LINE_KINDS[kind].fields) {
    const r = readField(f, (form[f.key] ?? '').trim())
    if ('error' in r) errors[f.key] = r.error
    else fields[f.key] = r.value
  }
  const v = validateCreate(LINE_KINDS[kind].table, fields)
  if (!v.ok) for (const [k, m] of Object.entries(v.errors)) errors[k] ??= m
  return Object.keys(errors).length ? { ok: false as const, errors } : { ok: true as const, fields }
}
