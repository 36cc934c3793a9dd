// The sync wire protocol: push and pull bodies, mutation names and their arguments.
import { z } from 'zod'
import { ENTITY_MUTATIONS, ENTITY_TABLES, type EntityTable } from './entities'
import { id } from '../schemas/records'

/**
 * Bumped when a mutation's arguments or a table's shape change incompatibly (2: notes and bench
 * results carry createdBy; 3: tube stock tables, so stored cookies start over and bring them;
 * 4: the shops' retube suggestions for shared rigs).
 */
export const SYNC_SCHEMA_VERSION = 4
export const PULL_PAGE_SIZE = 500
export const MAX_PUSH_MUTATIONS = 500

export const MUTATION_ARGS = {
  'conflict.resolve': z.object({ id, value: z.unknown() }),
  ...ENTITY_MUTATIONS,
} as const

export type MutationName = keyof typeof MUTATION_ARGS
export const MUTATION_NAMES = Object.keys(MUTATION_ARGS) as MutationName[]
export type MutationArgs<N extends MutationName> = z.infer<(typeof MUTATION_ARGS)[N]>

export const isMutationName = (name: string): name is MutationName => name in MUTATION_ARGS

export const mutationSchema = z.object({
  id: z.number().int().positive(),
  uuid: id,
  name: z.string().min(1).max(64),
  args: z.unknown(),
  baseVersion: z.number().int().nonnegative().optional(),
})
export type Mutation = z.infer<typeof mutationSchema>

export const pushBodySchema = z.object({
  clientId: id,
  shopId: id,
  schemaVersion: z.number().int().positive(),
  mutations: z.array(mutationSchema).max(MAX_PUSH_MUTATIONS),
})
export type PushBody = z.infer<typeof pushBodySchema>

export type MutationStatus = 'applied' | 'duplicate' | 'rejected' | 'conflict'
export interface MutationResult {
  id: number
  status: MutationStatus
  reason?: string
  /** For a duplicate: what happened the first time. */
  was?: Exclude<MutationStatus, 'duplicate'>
}
export interface PushReply { lmid: number, results: MutationResult[] }

export const pullBodySchema = z.object({
  clientId: id,
  shopId: id,
  schemaVersion: z.number().int().positive(),
  cookie: z.string().max(500).nullable(),
})
export type PullBody = z.infer<typeof pullBodySchema>

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
