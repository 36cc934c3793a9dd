import { randomUUID } from 'node:crypto'
import { shopCreateSchema } from '#shared/utils/schemas/auth'

export default defineEventHandler(async (event) => {
  const userId = await requireUserId(event)
  const body = await validBody(event, shopCreateSchema)
  const id = body.id ?? randomUUID()
  await useDb().transaction(async (tx) => {
    await tx.insert(tables.shops).values({ id, name: body.name })
    await tx.insert(tables.memberships).values({ shopId: id, userId, role: 'owner' })
    await audit(tx, { shopId: id, userId, action: 'shop.create', detail: { name: body.name } })
  })
  await setSessionShop(event, id)
  setResponseStatus(event, 201)
  return await loadMe(userId, id)
})
