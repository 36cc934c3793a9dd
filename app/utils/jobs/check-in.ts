// The check-in form's validation: the same zod schemas the server applies, with the message beside each field.
import type { z } from 'zod'
import { ENTITY_DEFAULTS, ENTITY_FIELDS, type EntityFields, type EntityTable } from '../../../shared/utils/sync/entities'

export type FieldErrors = Record<string, string>

/** The first message for each field of a zod error, keyed `<prefix><field>`. */
export function fieldErrors(error: z.ZodError, prefix = ''): FieldErrors {
  const errors: FieldErrors = {}
  for (const issue of error.issues) errors[`${prefix}${String(issue.path[0] ?? '')}`] ??= issue.message
  return errors
}

/** Validates a create for `table` (defaults filled); errors keyed `<prefix><field>`. */
export function validateCreate<T extends EntityTable>(table: T, fields: Record<string, unknown>, prefix = ''): { ok: true, value: EntityFields<T> } | { ok: false, errors: FieldErrors } {
  const r = ENTITY_FIELDS[table].safeParse({ ...ENTITY_DEFAULTS[table], ...fields })
  return r.success ? { ok: true, value: r.data as EntityFields<T> } : { ok: false, errors: fieldErrors(r.error, prefix) }
}

export const centsToText = (cents: number) => (cents / 100).toFixed(2)
