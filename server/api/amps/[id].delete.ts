import { idParams } from '#shared/utils/schemas/records'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('amps', 'remove'))
  const { id } = await validParams(event, idParams)
  return deleteEntity(access, 'amps', id)
})
