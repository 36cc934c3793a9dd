// REST bodies for shop tube stock, made from the sync record fields (the same rules offline and online).
import { z } from 'zod'
import { ENTITY_FIELDS } from '../sync/entities'
import { createBody, id, patchBody } from './records'

export const tubeLotCreateBody = createBody(ENTITY_FIELDS.tubeLots)
export const tubeLotPatchBody = patchBody(ENTITY_FIELDS.tubeLots.omit({ tubeType: true }))
export const stockTubeCreateBody = createBody(ENTITY_FIELDS.stockTubes)
export const stockTubePatchBody = patchBody(ENTITY_FIELDS.stockTubes.omit({ lotId: true }))
export const matchedSetCreateBody = createBody(ENTITY_FIELDS.matchedSets.omit({ status: true, fittedJobId: true, fittedAt: true }))
export const matchedSetPatchBody = patchBody(ENTITY_FIELDS.matchedSets.pick({ label: true, priceCents: true }))

/** Fit a set to a job: it leaves stock and becomes one of the job's parts. */
export const matchedSetFitBody = z.object({
  jobId: id,
  priceCents: ENTITY_FIELDS.matchedSets.shape.priceCents.optional(),
})
