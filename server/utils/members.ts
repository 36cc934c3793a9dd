import { and, eq, ne, sql } from 'drizzle-orm'

/** Lock the shop's memberships and refuse a change that would leave it without an owner. */
export async function assertOwnerRemains(tx: Tx, shopId: string, userId: string) {
  const [row] = await tx.select({ n: sql<number>`count(*)` }).from(tables.memberships)
    .where(and(eq(tables.memberships.shopId, shopId), eq(tables.memberships.role, 'owner'), ne(tables.memberships.userId, userId)))
    .for('update')
  if (!row || Number(row.n) === 0) {
    throw createError({ statusCode: 409, message: 'A shop needs at least one owner. Make someone else an owner first.' })
  }
}

export async function findMember(tx: Tx, shopId: string, userId: string) {
  const [m] = await tx.select().from(tables.memberships)
    .where(and(eq(tables.memberships.shopId, shopId), eq(tables.memberships.userId, userId))).for('update')
  if (!m) throw createError({ statusCode: 404, message: 'Member not found.' })
  return m
}
