import { idParams } from '#shared/utils/schemas/records'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('jobs', 'remove'))
  const { id } = await validParams(event, idParams)
  return deleteEntity(access, 'jobs', id)
})
