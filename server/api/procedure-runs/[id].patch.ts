import { idParams } from '#shared/utils/jobs/schemas'
import { runPatchBody } from '#shared/utils/procedures/schemas'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('procedureRuns', 'update'))
  const { id } = await validParams(event, idParams)
  const fields = await validBody(event, runPatchBody)
  await findRun(access, id)
  await patchEntity(access, 'procedureRuns', id, fields)
  return findRun(access, id)
})
