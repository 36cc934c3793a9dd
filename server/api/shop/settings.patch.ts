import { settingsPatchBody } from '#shared/utils/schemas/jobs'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('shopSettings', 'update'))
  const patch = await validBody(event, settingsPatchBody)
  const db = useDb()
  await db.transaction(async (tx) => {
    const next = { ...(await shopSettingsOf(tx, access.shopId)), ...patch }
    await tx.insert(tables.shopSettings).values({ shopId: access.shopId, ...next }).onDuplicateKeyUpdate({ set: patch })
    await audit(tx, { shopId: access.shopId, userId: access.userId, action: 'shop.settings', detail: patch })
  })
  return shopSettingsOf(db, access.shopId)
})
