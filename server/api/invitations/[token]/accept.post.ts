import { eq } from 'drizzle-orm'
import { tokenParamsSchema } from '#shared/utils/schemas/auth'

export default defineEventHandler(async (event) => {
  const userId = await requireUserId(event)
  const { token } = await validParams(event, tokenParamsSchema)
  const db = useDb()
  const [user] = await db.select({ email: tables.users.email }).from(tables.users).where(eq(tables.users.id, userId))
  if (!user) throw createError({ statusCode: 401, message: 'Sign in first.' })
  const shopId = await db.transaction(tx => acceptInvitation(tx, token, { id: userId, email: user.email }))
  await setSessionShop(event, shopId)
  return await loadMe(userId, shopId)
})
