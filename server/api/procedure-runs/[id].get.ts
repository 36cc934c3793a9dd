import { idParams } from '#shared/utils/jobs/schemas'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event)
  const { id } = await validParams(event, idParams)
  return findRun(access, id)
})
