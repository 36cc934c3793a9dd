import { idParams } from '#shared/utils/schemas/records'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event)
  const { id } = await validParams(event, idParams)
  return findRun(access, id)
})
