import { ampCreateBody } from '#shared/utils/schemas/jobs'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('amps', 'create'))
  const body = await validBody(event, ampCreateBody)
  const amp = await createEntity(access, 'amps', body)
  setResponseStatus(event, 201)
  return amp
})
