import { eq } from 'drizzle-orm'
import { idParams, INVOICE_MOVES, invoicePatchBody } from '#shared/utils/schemas/jobs'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('invoices', 'update'))
  const { id } = await validParams(event, idParams)
  const { state } = await validBody(event, invoicePatchBody)
  const db = useDb()
  const before = await findInvoice(db, access.shopId, id)
  let payToken: string | undefined
  await withRetry(() => db.transaction(async (tx) => {
    payToken = undefined
    const version = await nextShopVersion(tx, access.shopId)
    const current = await findInvoice(tx, access.shopId, id, { lock: true })
    if (!INVOICE_MOVES[current.state]?.includes(state)) {
      throw createError({ statusCode: 400, message: `A ${current.state} ${current.kind} cannot be marked ${state}.` })
    }
    await tx.update(tables.invoices).set({ state, version, ...(state === 'sent' ? { issuedAt: new Date() } : {}) }).where(eq(tables.invoices.id, id))
    // A sent invoice gets the link its e-mail carries; a withdrawn one keeps none.
    if (state === 'sent' && current.kind === 'invoice') payToken = (await issuePayLink(tx, { shopId: access.shopId, invoiceId: id, userId: access.userId })).token
    if (state === 'void') await revokePayLinks(tx, { shopId: access.shopId, invoiceId: id, userId: access.userId })
    await audit(tx, { shopId: access.shopId, userId: access.userId, action: `invoice.${state}`, detail: { invoiceId: id } })
  }))
  if (state === 'sent') {
    const token = payToken
    runAfterCommit([() => sendInvoiceMail(access.shopId, before, token)])
  }
  return findInvoice(db, access.shopId, id)
})
