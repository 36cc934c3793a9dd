// Payloads of the procedure REST routes: the sync record fields, so both paths check the same rules.
import { z } from 'zod'
import { ENTITY_FIELDS } from '../sync/entities'
import { createBody, page, pageSize, patchBody } from './records'

export const gateCreateBody = createBody(ENTITY_FIELDS.procedureGates)
export const runCreateBody = createBody(ENTITY_FIELDS.procedureRuns)
export const runPatchBody = patchBody(ENTITY_FIELDS.procedureRuns)

export const runListQuery = z.object({ job: z.uuid({ message: 'must be an id' }).optional(), page, pageSize })
