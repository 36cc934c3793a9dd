import { customerCreateBody } from '#shared/utils/schemas/jobs'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('customers', 'create'))
  const body = await validBody(event, customerCreateBody)
  const customer = await createEntity(access, 'customers', body)
  setResponseStatus(event, 201)
  return customer
})
