import { and, asc, eq, isNull } from 'drizzle-orm'
import type { MePayload } from '#shared/types/me'
import { ensurePersonalSpace } from './personal-space'

export async function loadMe(userId: string, activeShopId?: string | null): Promise<MePayload | null> {
  const db = useDb()
  // Two independent reads side by side; the personal space only for a live user (it may write).
  const [[user], memberships] = await Promise.all([
    db.select({ id: tables.users.id, name: tables.users.name, email: tables.users.email })
      .from(tables.users).where(and(eq(tables.users.id, userId), isNull(tables.users.deletedAt))).limit(1),
    db.select({ shopId: tables.shops.id, shopName: tables.shops.name, role: tables.memberships.role })
      .from(tables.memberships)
      .innerJoin(tables.shops, eq(tables.shops.id, tables.memberships.shopId))
      .where(and(eq(tables.memberships.userId, userId), isNull(tables.shops.deletedAt), eq(tables.shops.kind, 'shop')))
      .orderBy(asc(tables.shops.name)),
  ])
  if (!user) return null
  // The user's own space (rigs) is never one of the shops: the switcher and shop screens stay as they were.
  const personalSpaceId = await ensurePersonalSpace(db, userId)
  const active = memberships.find(m => m.shopId === activeShopId) ?? memberships[0] ?? null
  return {
    user,
    memberships,
    personalSpaceId,
    activeShop: active ? { id: active.shopId, name: active.shopName, role: active.role } : null,
  }
}
