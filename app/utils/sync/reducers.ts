// How a pending change looks on this device before the server confirms it, and how a
// server row becomes a view row. Pure functions, replayed on top of server rows (rebase).
import type { SyncedTable } from '#shared/utils/sync/protocol'
import type { ConflictRow, EntityRow, InvoiceRow, JobEventRow, OutboxRow, ServerRow } from './local-db'
import { ENTITY_DEFAULTS, entityOf, type EntityTable } from '#shared/utils/sync/entity-names'

export type ViewRow = ConflictRow | EntityRow<EntityTable> | JobEventRow | InvoiceRow
export const key = (table: SyncedTable, id: string) => `${table}:${id}`

export function serverToView(s: ServerRow): ViewRow {
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- server rows are checked by the protocol
  const d = (s.data ?? {}) as Record<string, any>
  const base = { id: s.id, shopId: s.shopId, version: s.version, deleted: s.deleted, pending: 0 }
  if (s.table !== 'conflicts') {
    const { fieldVersions: _fv, deletedAt: _d, ...rest } = d
    return { ...rest, ...base } as ViewRow
  }
  return {
    ...base, tableName: d.tableName, rowId: d.rowId, field: d.field, serverValue: d.serverValue, clientValue: d.clientValue,
    serverAuthor: d.serverAuthor ?? null, clientAuthor: d.clientAuthor, serverChangedAt: d.serverChangedAt ?? null,
    clientChangedAt: d.clientChangedAt, status: d.status, note: d.note ?? null,
  } satisfies ConflictRow
}

export interface ReduceContext {
  userId: string
  shopId: string
  /** Looks up a conflict the change refers to (conflict.resolve touches the record too). */
  conflict?: ConflictRow
}

/** Apply one pending change to the row it targets in `table`. */
export function reduce(table: SyncedTable, row: ViewRow | undefined, m: OutboxRow, ctx: ReduceContext): ViewRow | undefined {
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- args were validated when the change was made
  const a = m.args as Record<string, any>
  const at = m.createdAt
  const bump = <T extends ViewRow>(r: T, patch: Partial<T>): T => ({ ...r, ...patch, pending: r.pending + 1 })
  const entity = entityOf(m.name)
  if (entity) return reduceEntity(entity.table, entity.verb, row, a, at, ctx)
  if (m.name !== 'conflict.resolve') return row
  if (table === 'conflicts') return row ? bump(row as ConflictRow, { status: 'resolved' }) : row
  const c = ctx.conflict
  if (!row || !c) return row
  if (c.field === '_delete') return bump(row, { deleted: a.value === true })
  return bump(row, { [c.field]: a.value, deleted: false } as Partial<ViewRow>)
}

/** The records a change touches, as `table:id` keys. */
export function targetsOf(m: Pick<OutboxRow, 'name' | 'args'>, conflict?: ConflictRow): string[] {
  const id = String((m.args as { id: string }).id)
  const entity = entityOf(m.name)
  if (entity) return [key(entity.table, id)]
  return conflict ? [key('conflicts', id), key(conflict.tableName, conflict.rowId)] : [key('conflicts', id)]
}

function reduceEntity(table: EntityTable, verb: 'create' | 'setFields' | 'delete' | 'restore', row: ViewRow | undefined, a: Record<string, unknown>, at: string, ctx: ReduceContext): ViewRow | undefined {
  const bump = (patch: Record<string, unknown>) => (row ? ({ ...row, ...patch, pending: row.pending + 1 } as ViewRow) : row)
  switch (verb) {
    case 'create': {
      if (row) return bump({})
      const { id, ...fields } = a
      return { ...ENTITY_DEFAULTS[table], ...fields, id: String(id), shopId: ctx.shopId, version: 0, deleted: false, pending: 1, createdBy: ctx.userId, updatedBy: ctx.userId, createdAt: at, updatedAt: at } as unknown as ViewRow
    }
    case 'setFields': {
      const fields = Object.fromEntries(Object.entries((a.fields ?? {}) as Record<string, unknown>).filter(([, v]) => v !== undefined))
      return bump({ ...fields, updatedAt: at, updatedBy: ctx.userId })
    }
    case 'delete':
      return bump({ deleted: true })
    case 'restore':
      return bump({ deleted: false })
  }
}
