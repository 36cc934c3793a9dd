import { eq } from 'drizzle-orm'
import { tokenParamsSchema } from '#shared/utils/schemas/auth'

// Public: the invitee may not have an account yet.
export default defineEventHandler(async (event) => {
  const { token } = await validParams(event, tokenParamsSchema)
  const db = useDb()
  const inv = await findLiveInvitation(db, token)
  if (!inv) throw createError({ statusCode: 404, message: 'This invitation is no longer valid. Ask the shop for a new one.' })
  const [shop] = await db.select({ name: tables.shops.name }).from(tables.shops).where(eq(tables.shops.id, inv.shopId))
  return { shopName: shop?.name ?? '', email: inv.email, role: inv.role, expiresAt: inv.expiresAt }
})
