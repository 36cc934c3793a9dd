import { randomUUID } from 'node:crypto'
import { eq } from 'drizzle-orm'
import { tubeCreateSchema } from '#shared/utils/schemas/tubes'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('tubes', 'create'))
  const body = await validBody(event, tubeCreateSchema)
  const id = body.id ?? randomUUID()
  const db = useDb()
  await db.transaction(async (tx) => {
    const [taken] = await tx.select({ shopId: tables.tubes.shopId }).from(tables.tubes).where(eq(tables.tubes.id, id)).limit(1)
    if (taken) throw createError({ statusCode: 409, message: 'A tube with this id already exists.' })
    await tx.insert(tables.tubes).values({ ...body, id, shopId: access.shopId })
    await audit(tx, { shopId: access.shopId, userId: access.userId, action: 'tube.create', detail: { tubeId: id, name: body.name } })
  })
  setResponseStatus(event, 201)
  return libraryTubeFromRow(await findShopTube(db, access.shopId, id))
})
