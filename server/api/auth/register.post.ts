import { randomUUID } from 'node:crypto'
import { eq } from 'drizzle-orm'
import { registerSchema } from '#shared/utils/schemas/auth'

export default defineEventHandler(async (event) => {
  const body = await validBody(event, registerSchema)
  const db = useDb()
  const [existing] = await db.select({ id: tables.users.id }).from(tables.users).where(eq(tables.users.email, body.email)).limit(1)
  if (existing) throw createError({ statusCode: 409, message: 'An account with this e-mail already exists. Sign in instead.' })

  const id = randomUUID()
  const passwordHash = await hashPassword(body.password)
  let joinedShopId: string | null = null
  await db.transaction(async (tx) => {
    await tx.insert(tables.users).values({ id, email: body.email, name: body.name, passwordHash })
    await audit(tx, { userId: id, action: 'auth.register' })
    if (body.invitationToken) joinedShopId = await acceptInvitation(tx, body.invitationToken, { id, email: body.email })
  })
  await startSession(event, id, joinedShopId)
  setResponseStatus(event, 201)
  return await loadMe(id, joinedShopId)
})
