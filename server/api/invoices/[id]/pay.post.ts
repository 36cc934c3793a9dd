import { idParams } from '#shared/utils/schemas/records'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('invoices', 'pay'))
  const { id } = await validParams(event, idParams)
  const invoice = await visibleInvoice(access, id)
  const started = await startOnlinePayment(access.shopId, invoice.id, access.userId)
  // The invoice is marked paid only when the provider's webhook says so.
  setResponseStatus(event, 202)
  return started
})
