import { customerPatchBody, idParams } from '#shared/utils/schemas/jobs'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('customers', 'update'))
  const { id } = await validParams(event, idParams)
  const fields = await validBody(event, customerPatchBody)
  return patchEntity(access, 'customers', id, fields)
})
