import { idParams, jobPatchBody } from '#shared/utils/schemas/jobs'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('jobs', 'update'))
  const { id } = await validParams(event, idParams)
  const fields = await validBody(event, jobPatchBody)
  return patchEntity(access, 'jobs', id, fields)
})
