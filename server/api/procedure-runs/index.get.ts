import { runListQuery } from '#shared/utils/schemas/procedures'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event)
  const query = await validQuery(event, runListQuery)
  return listRuns(access, query)
})
