import { and, eq, isNull } from 'drizzle-orm'

export const INVITATION_DAYS = 7

/** Find a live invitation by its raw token; null when unknown, used, revoked or expired. */
export async function findLiveInvitation(db: Db | Tx, token: string) {
  const [inv] = await db.select().from(tables.invitations)
    .where(and(eq(tables.invitations.tokenHash, hashToken(token)), isNull(tables.invitations.deletedAt)))
    .limit(1)
  if (!inv || inv.acceptedAt || inv.expiresAt.getTime() < Date.now()) return null
  return inv
}

/** Accept for this user (the e-mail must match); returns the shop id joined. */
export async function acceptInvitation(tx: Tx, token: string, user: { id: string, email: string }): Promise<string> {
  const inv = await findLiveInvitation(tx, token)
  if (!inv) throw createError({ statusCode: 404, message: 'This invitation is no longer valid. Ask the shop for a new one.' })
  if (inv.email !== user.email) {
    throw createError({ statusCode: 403, message: `This invitation is for ${inv.email}. Sign in with that address.` })
  }
  const [member] = await tx.select({ role: tables.memberships.role }).from(tables.memberships)
    .where(and(eq(tables.memberships.shopId, inv.shopId), eq(tables.memberships.userId, user.id))).limit(1)
  if (!member) await tx.insert(tables.memberships).values({ shopId: inv.shopId, userId: user.id, role: inv.role })
  await tx.update(tables.invitations).set({ acceptedAt: new Date(), acceptedBy: user.id }).where(eq(tables.invitations.id, inv.id))
  await audit(tx, { shopId: inv.shopId, userId: user.id, action: 'invitation.accept', detail: { invitationId: inv.id, role: inv.role } })
  return inv.shopId
}
