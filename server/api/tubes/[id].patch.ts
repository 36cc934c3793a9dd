import { and, eq } from 'drizzle-orm'
import { tubeParamsSchema, tubePatchSchema } from '#shared/utils/schemas/tubes'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('tubes', 'update'))
  const { id } = await validParams(event, tubeParamsSchema)
  refuseBuiltin(id)
  const patch = await validBody(event, tubePatchSchema)
  const db = useDb()
  await db.transaction(async (tx) => {
    await findShopTube(tx, access.shopId, id)
    await tx.update(tables.tubes).set(patch).where(and(eq(tables.tubes.id, id), eq(tables.tubes.shopId, access.shopId)))
    await audit(tx, { shopId: access.shopId, userId: access.userId, action: 'tube.update', detail: { tubeId: id, fields: Object.keys(patch) } })
  })
  return libraryTubeFromRow(await findShopTube(db, access.shopId, id))
})
