import { randomUUID } from 'node:crypto'
import { eq } from 'drizzle-orm'
import { inviteSchema, shopParamsSchema } from '#shared/utils/schemas/auth'

export default defineEventHandler(async (event) => {
  const { shopId } = await validParams(event, shopParamsSchema)
  const access = await requireShopRole(event, shopId, rolesFor('invitations', 'create'))
  const { email, role } = await validBody(event, inviteSchema)
  const db = useDb()
  const token = newToken()
  const id = randomUUID()
  const expiresAt = new Date(Date.now() + INVITATION_DAYS * 86_400_000)
  await db.transaction(async (tx) => {
    await tx.insert(tables.invitations).values({ id, shopId, email, role, tokenHash: hashToken(token), invitedBy: access.userId, expiresAt })
    await audit(tx, { shopId, userId: access.userId, action: 'invitation.create', detail: { invitationId: id, email, role } })
  })
  const [shop] = await db.select({ name: tables.shops.name }).from(tables.shops).where(eq(tables.shops.id, shopId))
  const link = `${useRuntimeConfig().publicOrigin}/invite/${token}`
  const mailed = await sendMail({
    shopId,
    to: email,
    subject: `You're invited to ${shop?.name ?? 'a shop'} on Tubewright`,
    text: `You have been invited to join ${shop?.name ?? 'a shop'} on Tubewright as ${ROLE_LABELS[role]}.\n\n`
      + `Open this link to accept (valid for ${INVITATION_DAYS} days):\n${link}\n\nIf you were not expecting this, ignore this message.`,
  })
  setResponseStatus(event, 201)
  return { id, email, role, expiresAt, link, mailed }
})
