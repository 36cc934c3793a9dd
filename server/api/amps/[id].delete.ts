import { idParams } from '#shared/utils/jobs/schemas'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('amps', 'remove'))
  const { id } = await validParams(event, idParams)
  return deleteEntity(access, 'amps', id)
})
