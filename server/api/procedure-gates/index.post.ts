import { gateCreateBody } from '#shared/utils/schemas/procedures'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('procedureGates', 'create'))
  const body = await validBody(event, gateCreateBody)
  const gate = await createEntity(access, 'procedureGates', body)
  setResponseStatus(event, 201)
  return gate
})
