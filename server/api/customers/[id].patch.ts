import { customerPatchBody, idParams } from '#shared/utils/jobs/schemas'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('customers', 'update'))
  const { id } = await validParams(event, idParams)
  const fields = await validBody(event, customerPatchBody)
  return patchEntity(access, 'customers', id, fields)
})
