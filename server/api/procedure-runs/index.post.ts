import { runCreateBody } from '#shared/utils/schemas/procedures'

// The run's own safety check must already be in (POST /api/procedure-gates); otherwise 400.
export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('procedureRuns', 'create'))
  const body = await validBody(event, runCreateBody)
  const run = await createEntity(access, 'procedureRuns', body)
  setResponseStatus(event, 201)
  return findRun(access, run.id as string)
})
