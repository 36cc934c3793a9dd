import { counterPaymentBody, idParams } from '#shared/utils/schemas/jobs'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('invoices', 'update'))
  const { id } = await validParams(event, idParams)
  const body = await validBody(event, counterPaymentBody)
  return takeCounterPayment(access, id, body)
})
