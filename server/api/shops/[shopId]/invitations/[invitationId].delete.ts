import { and, eq, isNull } from 'drizzle-orm'
import { invitationParamsSchema } from '#shared/utils/schemas/auth'

export default defineEventHandler(async (event) => {
  const { shopId, invitationId } = await validParams(event, invitationParamsSchema)
  const access = await requireShopRole(event, shopId, rolesFor('invitations', 'remove'))
  const db = useDb()
  const where = and(eq(tables.invitations.id, invitationId), eq(tables.invitations.shopId, shopId), isNull(tables.invitations.deletedAt))
  const [inv] = await db.select({ id: tables.invitations.id }).from(tables.invitations).where(where)
  if (!inv) throw createError({ statusCode: 404, message: 'Invitation not found.' })
  await db.update(tables.invitations).set({ deletedAt: new Date() }).where(where)
  await audit(db, { shopId, userId: access.userId, action: 'invitation.revoke', detail: { invitationId } })
  return { ok: true }
})
