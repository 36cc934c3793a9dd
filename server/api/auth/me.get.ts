export default defineEventHandler(async (event) => {
  const session = await requireUserSession(event, { message: 'Sign in first.' })
  const me = await withRetry(() => loadMe(session.user.id, session.activeShopId))
  if (!me) {
    await endSession(event)
    throw createError({ statusCode: 401, message: 'Sign in first.' })
  }
  return me
})
