// The check-in form's validation: the same zod schemas the server applies, with the message beside each field.
import { ENTITY_DEFAULTS, ENTITY_FIELDS, type EntityFields, type EntityTable } from '#shared/utils/sync/entities'

export type FieldErrors = Record<string, string>

/** Validates a create for `table` (defaults filled); errors keyed `<prefix><field>`. */
export function validateCreate<T extends EntityTable>(table: T, fields: Record<string, unknown>, prefix = ''): { ok: true, value: EntityFields<T> } | { ok: false, errors: FieldErrors } {
  const r = ENTITY_FIELDS[table].safeParse({ ...ENTITY_DEFAULTS[table], ...fields })
  if (r.success) return { ok: true, value: r.data as EntityFields<T> }
  const errors: FieldErrors = {}
  for (const issue of r.error.issues) {
    const key = `${prefix}${String(issue.path[0] ?? '')}`
    errors[key] ??= issue.message
  }
  return { ok: false, errors }
}

export const centsToText = (cents: number) => (cents / 100).toFixed(2)
