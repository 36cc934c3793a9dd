import { and, eq, isNull } from 'drizzle-orm'
import type { LibraryTube } from '#shared/types/tubes'
import { BUILTIN_LIBRARY } from '#shared/utils/tubes/library'
import type { TubeRow } from '../db/schema/tubes'

export function libraryTubeFromRow(row: TubeRow): LibraryTube {
  return {
    id: row.id,
    name: row.name,
    maxPlateWatts: row.maxPlateWatts,
    maxScreenWatts: row.maxScreenWatts,
    maxPlateVolts: row.maxPlateVolts,
    heater: row.heater,
    ratingSystem: row.ratingSystem,
    source: row.source,
    kind: 'shop',
  }
}

/** A live (not retired) entry of this shop; missing, retired and other shops' all answer 404. */
export async function findShopTube(db: Db | Tx, shopId: string, id: string): Promise<TubeRow> {
  const [row] = await db.select().from(tables.tubes)
    .where(and(eq(tables.tubes.id, id), eq(tables.tubes.shopId, shopId), isNull(tables.tubes.deletedAt)))
    .limit(1)
  if (!row) throw createError({ statusCode: 404, message: 'Tube not found.' })
  return row
}

/** Built-in entries are part of the app and cannot be changed through the API. */
export function refuseBuiltin(id: string) {
  if (BUILTIN_LIBRARY.some(t => t.id === id)) {
    throw createError({ statusCode: 403, message: 'Built-in tubes cannot be changed. Add a shop entry instead.' })
  }
}
