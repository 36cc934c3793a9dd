import { and, eq } from 'drizzle-orm'
import { memberParamsSchema, roleChangeSchema } from '#shared/utils/schemas/auth'

export default defineEventHandler(async (event) => {
  const { shopId, userId } = await validParams(event, memberParamsSchema)
  const access = await requireShopRole(event, shopId, rolesFor('members', 'update'))
  const { role } = await validBody(event, roleChangeSchema)
  await useDb().transaction(async (tx) => {
    const member = await findMember(tx, shopId, userId)
    if (member.role === role) return
    if (member.role === 'owner') await assertOwnerRemains(tx, shopId, userId)
    await tx.update(tables.memberships).set({ role })
      .where(and(eq(tables.memberships.shopId, shopId), eq(tables.memberships.userId, userId)))
    await audit(tx, { shopId, userId: access.userId, action: 'member.role', detail: { member: userId, from: member.role, to: role } })
  })
  return { userId, role }
})
