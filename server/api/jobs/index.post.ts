import { jobCreateBody } from '#shared/utils/schemas/jobs'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('jobs', 'create'))
  const body = await validBody(event, jobCreateBody)
  const job = await createEntity(access, 'jobs', body)
  setResponseStatus(event, 201)
  return job
})
