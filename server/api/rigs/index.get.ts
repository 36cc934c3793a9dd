export default defineEventHandler(async (event) => {
  const session = await requireUserSession(event, { message: 'Sign in first.' })
  return withRetry(() => listRigs(session.user.id, session.activeShopId))
})
