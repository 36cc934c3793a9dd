import { eq } from 'drizzle-orm'
import { idParams } from '#shared/utils/schemas/records'
import { applyDirect } from '../../../../utils/sync/direct'
import { fittedPartId } from '../../../../utils/sync/stock-policies'

/** A fitted set back into stock: one change, so the set and the job's part move together. Asked again, nothing moves twice. */
export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('matchedSets', 'update'))
  const { id } = await validParams(event, idParams)
  const before = await findEntity(useDb(), 'matchedSets', access.shopId, id)
  if (before.status === 'fitted') {
    await applyDirect(access, 'matchedSet.setFields', { id, fields: { status: 'in-stock', fittedJobId: null, fittedAt: '', priceCents: null } })
  }
  const set = await findEntity(useDb(), 'matchedSets', access.shopId, id)
  const [part] = await useDb().select().from(tables.jobParts).where(eq(tables.jobParts.id, fittedPartId(id)))
  return { set: publicRow(set), part: part ? publicRow(part) : null }
})
