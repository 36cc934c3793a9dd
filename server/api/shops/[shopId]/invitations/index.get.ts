import { and, desc, eq, gt, isNull } from 'drizzle-orm'
import { shopParamsSchema } from '#shared/utils/schemas/auth'

export default defineEventHandler(async (event) => {
  const { shopId } = await validParams(event, shopParamsSchema)
  await requireShopRole(event, shopId, rolesFor('invitations', 'read'))
  const invitations = await useDb()
    .select({ id: tables.invitations.id, email: tables.invitations.email, role: tables.invitations.role, expiresAt: tables.invitations.expiresAt, createdAt: tables.invitations.createdAt })
    .from(tables.invitations)
    .where(and(eq(tables.invitations.shopId, shopId), isNull(tables.invitations.acceptedAt), isNull(tables.invitations.deletedAt), gt(tables.invitations.expiresAt, new Date())))
    .orderBy(desc(tables.invitations.createdAt))
  return { invitations }
})
