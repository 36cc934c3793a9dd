import { and, eq } from 'drizzle-orm'
import { memberParamsSchema } from '#shared/utils/schemas/auth'

export default defineEventHandler(async (event) => {
  const { shopId, userId } = await validParams(event, memberParamsSchema)
  const access = await requireShopRole(event, shopId, rolesFor('members', 'remove'))
  await useDb().transaction(async (tx) => {
    const member = await findMember(tx, shopId, userId)
    if (member.role === 'owner') await assertOwnerRemains(tx, shopId, userId)
    await tx.delete(tables.memberships).where(and(eq(tables.memberships.shopId, shopId), eq(tables.memberships.userId, userId)))
    await audit(tx, { shopId, userId: access.userId, action: 'member.remove', detail: { member: userId, role: member.role } })
  })
  return { ok: true }
})
