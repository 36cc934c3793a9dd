import type { H3Event } from 'h3'
import { and, eq, isNull, sql } from 'drizzle-orm'
import type { Role } from '#shared/utils/roles'

export interface ShopAccess {
  userId: string
  shopId: string
  role: Role
  /** When this membership began (ms); a new membership means a fresh view of the shop. */
  memberSince: number
}

export async function requireUserId(event: H3Event): Promise<string> {
  const session = await requireUserSession(event, { message: 'Sign in first.' })
  return session.user.id
}

// Built once each: every shop route runs one of these.
const prepareMemberLookup = (personal: boolean) => useDb()
  .select({ role: tables.memberships.role, since: tables.memberships.createdAt })
  .from(tables.memberships)
  .innerJoin(tables.shops, eq(tables.shops.id, tables.memberships.shopId))
  .where(and(eq(tables.memberships.shopId, sql.placeholder('shopId')), eq(tables.memberships.userId, sql.placeholder('userId')), isNull(tables.shops.deletedAt),
    // A personal space is reached only by sync (`personal`); every shop route answers 404 for it.
    personal ? undefined : eq(tables.shops.kind, 'shop')))
  .limit(1)
  .prepare()
const memberLookup: { shop?: ReturnType<typeof prepareMemberLookup>, any?: ReturnType<typeof prepareMemberLookup> } = {}

/**
 * The one gate for shop-scoped routes: a non-member (or a missing shop) gets 404, so ids of
 * other shops reveal nothing; a member without one of `roles` gets 403. `personal`: the
 * signed-in person's own space (their rigs) is accepted too; only the sync routes pass it.
 */
export async function requireShopRole(event: H3Event, shopId: string, roles?: readonly Role[], opts: { personal?: boolean } = {}): Promise<ShopAccess> {
  const userId = await requireUserId(event)
  const lookup = opts.personal ? (memberLookup.any ??= prepareMemberLookup(true)) : (memberLookup.shop ??= prepareMemberLookup(false))
  const [row] = await lookup.execute({ shopId, userId })
  if (!row) throw createError({ statusCode: 404, message: 'Shop not found.' })
  if (roles && !roles.includes(row.role)) {
    throw createError({ statusCode: 403, message: 'Your role in this shop does not allow that.' })
  }
  return { userId, shopId, role: row.role, memberSince: row.since.getTime() }
}

/** Same gate for routes that work on the shop chosen in the session (the shop switcher). */
export async function requireActiveShopRole(event: H3Event, roles?: readonly Role[]): Promise<ShopAccess> {
  const session = await requireUserSession(event, { message: 'Sign in first.' })
  const shopId = session.activeShopId
  if (!shopId) throw createError({ statusCode: 409, message: 'Choose a shop first.' })
  return requireShopRole(event, shopId, roles)
}
