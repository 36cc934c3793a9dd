import { idParams } from '#shared/utils/schemas/records'
import { runPatchBody } from '#shared/utils/schemas/procedures'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('procedureRuns', 'update'))
  const { id } = await validParams(event, idParams)
  const fields = await validBody(event, runPatchBody)
  await findRun(access, id)
  await patchEntity(access, 'procedureRuns', id, fields)
  return findRun(access, id)
})
