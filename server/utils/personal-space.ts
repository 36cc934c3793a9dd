// Every user's personal space: a row in `shops` of kind 'personal' with the user as its only
// member (player). Rigs live there, so a player keeps and syncs them with or without a shop.
// Imports spelled out (not Nitro's auto-imports) so the demo seed, run by tsx, uses it too.
import { randomUUID } from 'node:crypto'
import { and, eq } from 'drizzle-orm'
import { tables, type Db } from './db'

/** The id of the user's personal space, made on first use (safe when two requests race). */
export async function ensurePersonalSpace(db: Db, userId: string): Promise<string> {
  const m = tables.memberships
  const find = () => db.select({ id: tables.shops.id, member: m.userId }).from(tables.shops)
    .leftJoin(m, and(eq(m.shopId, tables.shops.id), eq(m.userId, userId)))
    .where(and(eq(tables.shops.personalOf, userId), eq(tables.shops.kind, 'personal'))).limit(1)
  let [space] = await find()
  if (space?.member) return space.id
  if (!space) {
    // The unique index on personal_of makes a second insert (a racing request) a no-op.
    await db.insert(tables.shops).ignore().values({ id: randomUUID(), name: 'My rigs', kind: 'personal', personalOf: userId })
    ;[space] = await find()
  }
  if (!space) throw new Error('the personal space could not be made')
  await db.insert(m).ignore().values({ shopId: space.id, userId, role: 'player' })
  return space.id
}
