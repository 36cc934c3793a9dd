import { eq } from 'drizzle-orm'
import { idParams } from '#shared/utils/schemas/records'
import { matchedSetFitBody } from '#shared/utils/schemas/stock'
import { applyDirect } from '../../../../utils/sync/direct'
import { fittedPartId } from '../../../../utils/sync/stock-policies'

/** Fit a set to a job: one change, so the set leaves stock and the job gets its part together. */
export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('matchedSets', 'update'))
  const { id } = await validParams(event, idParams)
  const body = await validBody(event, matchedSetFitBody)
  await findEntity(useDb(), 'matchedSets', access.shopId, id)
  await applyDirect(access, 'matchedSet.setFields', {
    id, fields: { status: 'fitted', fittedJobId: body.jobId, fittedAt: new Date().toISOString(), ...(body.priceCents === undefined ? {} : { priceCents: body.priceCents }) },
  })
  const set = await findEntity(useDb(), 'matchedSets', access.shopId, id)
  const [part] = await useDb().select().from(tables.jobParts).where(eq(tables.jobParts.id, fittedPartId(id)))
  return { set: publicRow(set), part: part ? publicRow(part) : null }
})
