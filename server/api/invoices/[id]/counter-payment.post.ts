import { counterPaymentBody, idParams } from '#shared/utils/jobs/schemas'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, ['owner', 'desk'])
  const { id } = await validParams(event, idParams)
  const body = await validBody(event, counterPaymentBody)
  return takeCounterPayment(access, id, body)
})
