// Staff read every setting; a player reads what their job's totals are worked out with (tax, rate, currency).
export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event)
  const settings = await shopSettingsOf(useDb(), access.shopId)
  if (access.role !== 'player') return settings
  const { readyEmail: _internal, ...billing } = settings
  return billing
})
