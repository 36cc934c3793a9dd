import { activeShopSchema } from '#shared/utils/schemas/auth'

export default defineEventHandler(async (event) => {
  const { shopId } = await validBody(event, activeShopSchema)
  const access = await requireShopRole(event, shopId)
  await setSessionShop(event, shopId)
  return await loadMe(access.userId, shopId)
})
