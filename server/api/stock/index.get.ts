import { and, asc, eq, isNull } from 'drizzle-orm'

/** The shop's tube stock: every lot with its tubes' readings, and the matched sets. */
export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('tubeLots', 'read'))
  const db = useDb()
  const live = <T extends typeof tables.tubeLots | typeof tables.stockTubes | typeof tables.matchedSets>(t: T) => and(eq(t.shopId, access.shopId), isNull(t.deletedAt))
  const [lots, tubes, sets] = await Promise.all([
    db.select().from(tables.tubeLots).where(live(tables.tubeLots)).orderBy(asc(tables.tubeLots.createdAt)),
    db.select().from(tables.stockTubes).where(live(tables.stockTubes)).orderBy(asc(tables.stockTubes.label)),
    db.select().from(tables.matchedSets).where(live(tables.matchedSets)).orderBy(asc(tables.matchedSets.createdAt)),
  ])
  return {
    lots: lots.map(l => ({ ...publicRow(l), tubes: tubes.filter(t => t.lotId === l.id).map(publicRow) })),
    sets: sets.map(publicRow),
  }
})
