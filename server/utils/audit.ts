import { randomUUID } from 'node:crypto'

export async function audit(db: Db | Tx, entry: { shopId?: string | null, userId?: string | null, action: string, detail?: Record<string, unknown> }) {
  await db.insert(tables.auditLog).values({
    id: randomUUID(),
    shopId: entry.shopId ?? null,
    userId: entry.userId ?? null,
    action: entry.action,
    detail: entry.detail ?? null,
  })
}
