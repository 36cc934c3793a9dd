import { idParams } from '#shared/utils/jobs/schemas'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('amps', 'read'))
  const { id } = await validParams(event, idParams)
  return publicRow(await findEntity(useDb(), 'amps', access.shopId, id))
})
