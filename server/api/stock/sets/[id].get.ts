import { and, eq, inArray } from 'drizzle-orm'
import { idParams } from '#shared/utils/schemas/records'

/** One matched set with its tubes' readings (what its printed label carries). */
export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('matchedSets', 'read'))
  const { id } = await validParams(event, idParams)
  const set = await findEntity(useDb(), 'matchedSets', access.shopId, id) as unknown as typeof tables.matchedSets.$inferSelect
  const t = tables.stockTubes
  const tubes = await useDb().select().from(t).where(and(eq(t.shopId, access.shopId), inArray(t.id, set.tubeIds)))
  return { ...publicRow(set), tubes: tubes.map(publicRow) }
})
