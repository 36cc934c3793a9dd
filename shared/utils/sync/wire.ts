// The sync wire protocol's constants, tables and answers, as plain data; protocol.ts adds the
// bodies' and mutations' schemas (zod), which the device's sync engine does not load.
import { ENTITY_TABLES, type EntityTable } from './entity-names'

/**
 * Bumped when a mutation's arguments or a table's shape change incompatibly (2: notes and bench
 * results carry createdBy; 3: tube stock tables, so stored cookies start over and bring them;
 * 4: the shops' retube suggestions for shared rigs).
 */
export const SYNC_SCHEMA_VERSION = 4
export const PULL_PAGE_SIZE = 500
export const MAX_PUSH_MUTATIONS = 500

export type MutationStatus = 'applied' | 'duplicate' | 'rejected' | 'conflict'
export interface MutationResult {
  id: number
  status: MutationStatus
  reason?: string
  /** For a duplicate: what happened the first time. */
  was?: Exclude<MutationStatus, 'duplicate'>
}
export interface PushReply { lmid: number, results: MutationResult[] }

/** Server-written tables the client only reads. */
export const READ_ONLY_TABLES = ['jobEvents', 'invoices'] as const
export type SyncedTable = 'conflicts' | EntityTable | (typeof READ_ONLY_TABLES)[number]
export const SYNCED_TABLES: readonly SyncedTable[] = ['conflicts', ...ENTITY_TABLES, ...READ_ONLY_TABLES]
export interface RowChange {
  table: SyncedTable
  id: string
  version: number
  deleted: boolean
  data: Record<string, unknown> | null
}
export interface PullReply { cookie: string, lmid: number, reset: boolean, more: boolean, changes: RowChange[] }

/** Stable JSON (sorted keys) so the same mutation always hashes the same. */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== 'object') return JSON.stringify(value) ?? 'null'
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`
  const entries = Object.entries(value as Record<string, unknown>).filter(([, v]) => v !== undefined).sort(([a], [b]) => (a < b ? -1 : 1))
  return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`
}
