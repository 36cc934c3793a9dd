import { randomUUID } from 'node:crypto'
import type { ApplyContext } from './context'

export async function recordConflict(ctx: ApplyContext, c: {
  tableName: string
  rowId: string
  field: string
  serverValue: unknown
  clientValue: unknown
  serverAuthor: string | null
  serverChangedAt: Date | null
  note?: string
}) {
  await ctx.tx.insert(tables.syncConflicts).values({
    id: randomUUID(),
    shopId: ctx.shopId,
    tableName: c.tableName,
    rowId: c.rowId,
    field: c.field,
    serverValue: c.serverValue ?? null,
    clientValue: c.clientValue ?? null,
    serverAuthor: c.serverAuthor,
    clientAuthor: ctx.userId,
    serverChangedAt: c.serverChangedAt,
    clientChangedAt: ctx.now,
    mutationUuid: ctx.mutationUuid,
    version: ctx.version,
    note: c.note ?? null,
  })
}
