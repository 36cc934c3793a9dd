import { idParams, invoiceCreateBody } from '#shared/utils/schemas/jobs'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('invoices', 'create'))
  const { id } = await validParams(event, idParams)
  const { kind } = await validBody(event, invoiceCreateBody)
  const invoice = await withRetry(() => createInvoice(access, id, kind))
  setResponseStatus(event, 201)
  return invoice
})
