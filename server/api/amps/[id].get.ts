import { idParams } from '#shared/utils/schemas/records'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('amps', 'read'))
  const { id } = await validParams(event, idParams)
  return publicRow(await findEntity(useDb(), 'amps', access.shopId, id))
})
