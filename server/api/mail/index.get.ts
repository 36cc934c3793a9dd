import { desc, eq } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('mail', 'read'))
  const m = tables.sentMail
  const rows = await useDb().select().from(m).where(eq(m.shopId, access.shopId)).orderBy(desc(m.createdAt), desc(m.id)).limit(200)
  return { items: rows.map(r => ({ id: r.id, to: r.toAddress, subject: r.subject, body: r.body, delivered: r.delivered, retrying: !r.delivered && r.nextAttemptAt !== null, createdAt: r.createdAt })) }
})
