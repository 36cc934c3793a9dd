// What every record route shares: ids, paging, search text, and create/patch bodies made from
// the sync record fields, so a REST edit and an offline edit are checked by the same rules.
import { z } from 'zod'

export const id = z.uuid({ message: 'must be an id' })
export const idParams = z.object({ id })

export const page = z.coerce.number().int().min(1, { message: 'at least 1' }).max(100_000).default(1)
export const pageSize = z.coerce.number().int().min(1, { message: 'at least 1' }).max(100, { message: 'at most 100' }).default(25)
export const q = z.string().trim().max(100, { message: 'at most 100 characters' }).optional()

/** Create: the sync create's fields; the id may be sent (client-made) or left to the server. */
export const createBody = <S extends z.ZodObject>(fields: S) => fields.partial().extend({ id: id.optional() })
export const patchBody = <S extends z.ZodObject>(fields: S) => fields.partial().refine(f => Object.keys(f).length > 0, { message: 'change at least one field' })
