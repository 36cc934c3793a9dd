import { and, eq } from 'drizzle-orm'
import { tubeParamsSchema } from '#shared/utils/schemas/tubes'

// Retire, never erase: saved results may name the entry.
export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('tubes', 'remove'))
  const { id } = await validParams(event, tubeParamsSchema)
  refuseBuiltin(id)
  const db = useDb()
  await db.transaction(async (tx) => {
    await findShopTube(tx, access.shopId, id)
    await tx.update(tables.tubes).set({ deletedAt: new Date() }).where(and(eq(tables.tubes.id, id), eq(tables.tubes.shopId, access.shopId)))
    await audit(tx, { shopId: access.shopId, userId: access.userId, action: 'tube.retire', detail: { tubeId: id } })
  })
  return { id, retired: true }
})
