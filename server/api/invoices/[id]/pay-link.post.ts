import { idParams } from '#shared/utils/schemas/jobs'

// A fresh pay link (the old one stops working), e-mailed to the customer and handed to the desk to pass on.
export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('invoices', 'update'))
  const { id } = await validParams(event, idParams)
  const invoice = await findInvoice(useDb(), access.shopId, id)
  if (invoice.kind !== 'invoice' || invoice.state !== 'sent') {
    throw createError({ statusCode: 409, message: 'Only a sent, unpaid invoice has a pay link.' })
  }
  const link = await withRetry(() => useDb().transaction(tx => issuePayLink(tx, { shopId: access.shopId, invoiceId: id, userId: access.userId })))
  await audit(useDb(), { shopId: access.shopId, userId: access.userId, action: 'invoice.pay-link', detail: { invoiceId: id } })
  const mailed = await sendInvoiceMail(access.shopId, invoice, link.token)
  setResponseStatus(event, 201)
  return { url: payUrl(link.token), expiresAt: link.expiresAt, mailed }
})
