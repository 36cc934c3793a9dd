import { activeShopSchema } from '#shared/utils/schemas/auth'

export default defineEventHandler(async (event) => {
  const { shopId } = await validBody(event, activeShopSchema)
  const access = await requireShopRole(event, shopId)
  const session = await getUserSession(event)
  await replaceUserSession(event, { ...session, user: { id: access.userId }, activeShopId: shopId })
  return await loadMe(access.userId, shopId)
})
