import { eq } from 'drizzle-orm'
import { settingsPatchBody } from '#shared/utils/schemas/jobs'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('shopSettings', 'update'))
  const { name, ...patch } = await validBody(event, settingsPatchBody)
  const db = useDb()
  await db.transaction(async (tx) => {
    if (name !== undefined) await tx.update(tables.shops).set({ name }).where(eq(tables.shops.id, access.shopId))
    if (Object.keys(patch).length) {
      const { name: _name, ...current } = await shopSettingsOf(tx, access.shopId)
      await tx.insert(tables.shopSettings).values({ shopId: access.shopId, ...current, ...patch }).onDuplicateKeyUpdate({ set: patch })
    }
    await audit(tx, { shopId: access.shopId, userId: access.userId, action: 'shop.settings', detail: { name, ...patch } })
  })
  return shopSettingsOf(db, access.shopId)
})
