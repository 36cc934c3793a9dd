// The check-in form's validation: the same zod schemas the server applies, with the message beside each field.
import type { z } from 'zod'
import { ENTITY_DEFAULTS, ENTITY_FIELDS, type EntityFields, type EntityTable } from '#shared/utils/sync/entities'

export type FieldErrors = Record<string, string>

const count = (n: unknown) => Number(n).toLocaleString('en-US')

// A limit the schema states without words of its own ("Too big: expected number to be <=100000") in words.
function wordsOf(issue: z.core.$ZodIssue): string {
  if (issue.code === 'too_big' && issue.origin === 'number' && issue.message.startsWith('Too big')) return `at most ${count(issue.maximum)}`
  if (issue.code === 'too_small' && issue.origin === 'number' && issue.message.startsWith('Too small')) return `${issue.inclusive ? 'at least' : 'more than'} ${count(issue.minimum)}`
  return issue.message
}

/** The first message for each field of a zod error, keyed `<prefix><field>`. */
export function fieldErrors(error: z.ZodError, prefix = ''): FieldErrors {
  const errors: FieldErrors = {}
  for (const issue of error.issues) errors[`${prefix}${String(issue.path[0] ?? '')}`] ??= wordsOf(issue)
  return errors
}

/** Validates a create for `table` (defaults filled); errors keyed `<prefix><field>`. */
export function validateCreate<T extends EntityTable>(table: T, fields: Record<string, unknown>, prefix = ''): { ok: true, value: EntityFields<T> } | { ok: false, errors: FieldErrors } {
  const r = ENTITY_FIELDS[table].safeParse({ ...ENTITY_DEFAULTS[table], ...fields })
  return r.success ? { ok: true, value: r.data as EntityFields<T> } : { ok: false, errors: fieldErrors(r.error, prefix) }
}

export const centsToText = (cents: number) => (cents / 100).toFixed(2)
