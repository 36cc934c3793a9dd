import { ampPatchBody, idParams } from '#shared/utils/schemas/jobs'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('amps', 'update'))
  const { id } = await validParams(event, idParams)
  const fields = await validBody(event, ampPatchBody)
  return patchEntity(access, 'amps', id, fields)
})
