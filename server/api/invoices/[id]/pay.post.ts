import { idParams } from '#shared/utils/jobs/schemas'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, ['owner', 'desk', 'player'])
  const { id } = await validParams(event, idParams)
  const invoice = await visibleInvoice(access, id)
  const started = await startOnlinePayment(access.shopId, invoice.id, access.userId)
  // The invoice is marked paid only when the provider's webhook says so.
  setResponseStatus(event, 202)
  return started
})
