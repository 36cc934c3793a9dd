import { asc, eq } from 'drizzle-orm'
import { shopParamsSchema } from '#shared/utils/schemas/auth'

export default defineEventHandler(async (event) => {
  const { shopId } = await validParams(event, shopParamsSchema)
  await requireShopRole(event, shopId, rolesFor('members', 'read'))
  const members = await useDb()
    .select({ userId: tables.users.id, name: tables.users.name, email: tables.users.email, role: tables.memberships.role, since: tables.memberships.createdAt })
    .from(tables.memberships)
    .innerJoin(tables.users, eq(tables.users.id, tables.memberships.userId))
    .where(eq(tables.memberships.shopId, shopId))
    .orderBy(asc(tables.users.name))
  return { members }
})
