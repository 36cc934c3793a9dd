import { idParams } from '#shared/utils/schemas/jobs'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('invoices', 'update'))
  const { id } = await validParams(event, idParams)
  await findInvoice(useDb(), access.shopId, id)
  const revoked = await useDb().transaction(async (tx) => {
    const n = await revokePayLinks(tx, { shopId: access.shopId, invoiceId: id, userId: access.userId })
    await audit(tx, { shopId: access.shopId, userId: access.userId, action: 'invoice.pay-link.revoke', detail: { invoiceId: id, revoked: n } })
    return n
  })
  return { revoked }
})
