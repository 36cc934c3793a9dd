import { randomUUID } from 'node:crypto'
import type { ApplyContext } from './context'
import type { FieldStamps } from '../../db/schema/columns'

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

/** The stamp a field gets when this mutation changes it. */
export const stampFor = (ctx: ApplyContext) => ({ v: ctx.version, c: ctx.clientId, u: ctx.userId, at: ctx.now.toISOString() })

/** Fields another device changed after the version this mutation was based on. */
export function changedByOthers(ctx: ApplyContext, stamps: FieldStamps, fields: readonly string[]) {
  const base = ctx.baseVersion ?? 0
  return fields.filter((f) => {
    const s = stamps[f]
    return !!s && s.v > base && s.c !== ctx.clientId
  })
}
