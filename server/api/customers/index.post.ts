import { customerCreateBody } from '#shared/utils/jobs/schemas'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, ['owner', 'desk'])
  const body = await validBody(event, customerCreateBody)
  const customer = await createEntity(access, 'customers', body)
  setResponseStatus(event, 201)
  return customer
})
