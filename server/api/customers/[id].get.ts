import { idParams } from '#shared/utils/schemas/records'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('customers', 'read'))
  const { id } = await validParams(event, idParams)
  return publicRow(await findEntity(useDb(), 'customers', access.shopId, id))
})
