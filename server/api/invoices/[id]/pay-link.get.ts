import { idParams } from '#shared/utils/schemas/jobs'

// Whether the customer's e-mailed link still opens this invoice (the token itself is never kept).
export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('invoices', 'update'))
  const { id } = await validParams(event, idParams)
  const invoice = await findInvoice(useDb(), access.shopId, id)
  const live = await livePayLinkOf(useDb(), access.shopId, invoice.id)
  return { live: !!live, expiresAt: live?.expiresAt ?? null }
})
