import { and, asc, eq, isNull } from 'drizzle-orm'
import type { TubesPayload } from '#shared/types/tubes'
import { BUILTIN_LIBRARY } from '#shared/utils/tubes/library'

export default defineEventHandler(async (event): Promise<TubesPayload> => {
  const access = await requireActiveShopRole(event)
  const rows = await useDb().select().from(tables.tubes)
    .where(and(eq(tables.tubes.shopId, access.shopId), isNull(tables.tubes.deletedAt)))
    .orderBy(asc(tables.tubes.name))
  return { tubes: [...BUILTIN_LIBRARY, ...rows.map(libraryTubeFromRow)] }
})
