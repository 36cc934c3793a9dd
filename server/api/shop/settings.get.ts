// Staff read every setting; a player reads the shop's contact and what their job's totals are worked out with.
export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event)
  const settings = await shopSettingsOf(useDb(), access.shopId)
  if (access.role !== 'player') return settings
  const internal: readonly string[] = INTERNAL_SETTINGS
  return Object.fromEntries(Object.entries(settings).filter(([key]) => !internal.includes(key)))
})
