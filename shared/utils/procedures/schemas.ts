// Payloads of the procedure REST routes: the sync record fields, so both paths check the same rules.
import { z } from 'zod'
import { ENTITY_FIELDS } from '../sync/entities'
import { createBody, patchBody } from '../jobs/schemas'

export const gateCreateBody = createBody(ENTITY_FIELDS.procedureGates)
export const runCreateBody = createBody(ENTITY_FIELDS.procedureRuns)
export const runPatchBody = patchBody(ENTITY_FIELDS.procedureRuns)

const page = z.coerce.number().int().min(1, { message: 'at least 1' }).max(100_000).default(1)
const pageSize = z.coerce.number().int().min(1, { message: 'at least 1' }).max(100, { message: 'at most 100' }).default(25)
export const runListQuery = z.object({ job: z.uuid({ message: 'must be an id' }).optional(), page, pageSize })
