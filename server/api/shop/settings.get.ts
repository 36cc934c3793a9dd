export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, STAFF_ROLES)
  return shopSettingsOf(useDb(), access.shopId)
})
