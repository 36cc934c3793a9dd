import { idParams } from '#shared/utils/schemas/records'

export default defineEventHandler(async (event) => {
  const session = await requireUserSession(event, { message: 'Sign in first.' })
  const { id } = await validParams(event, idParams)
  return withRetry(() => rigDetail(session.user.id, session.activeShopId, id))
})
