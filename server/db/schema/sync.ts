import { bigint, index, json, mysqlEnum, mysqlTable, primaryKey, text, uniqueIndex, varchar } from 'drizzle-orm/mysql-core'
import { sql } from 'drizzle-orm'
import { stamp, uuid } from './columns'

const version = (name = 'version') => bigint(name, { mode: 'number', unsigned: true })

/** One row per shop: the version counter every synced change is stamped with (locked per mutation). */
export const shopVersions = mysqlTable('shop_versions', {
  shopId: uuid('shop_id').primaryKey(),
  version: version().notNull().default(0),
  // Tombstones at or below this version may have been purged; older cookies must reset.
  horizon: version('horizon').notNull().default(0),
})

/** A device's database for one user in one shop; lmid is the last mutation id applied. */
export const syncClients = mysqlTable('sync_clients', {
  id: uuid('id').primaryKey(),
  userId: uuid('user_id').notNull(),
  shopId: uuid('shop_id').notNull(),
  lmid: bigint('lmid', { mode: 'number', unsigned: true }).notNull().default(0),
  createdAt: stamp('created_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  lastSeenAt: stamp('last_seen_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
}, t => [index('sync_clients_user_idx').on(t.userId)])

export const MUTATION_STATUSES = ['applied', 'rejected', 'conflict'] as const

export const syncMutations = mysqlTable('sync_mutations', {
  clientId: uuid('client_id').notNull(),
  mutationId: bigint('mutation_id', { mode: 'number', unsigned: true }).notNull(),
  uuid: uuid('uuid').notNull(),
  name: varchar('name', { length: 64 }).notNull(),
  payloadHash: varchar('payload_hash', { length: 64 }).notNull(),
  status: mysqlEnum('status', MUTATION_STATUSES).notNull(),
  reason: varchar('reason', { length: 500 }),
  version: version(),
  userId: uuid('user_id').notNull(),
  createdAt: stamp('created_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
}, t => [
  primaryKey({ columns: [t.clientId, t.mutationId] }),
  uniqueIndex('sync_mutations_uuid_uq').on(t.uuid),
])

/** A field two people changed: the server kept one value, the other is kept here until someone decides. */
export const syncConflicts = mysqlTable('sync_conflicts', {
  id: uuid('id').primaryKey(),
  shopId: uuid('shop_id').notNull(),
  tableName: varchar('table_name', { length: 32 }).notNull(),
  rowId: uuid('row_id').notNull(),
  field: varchar('field', { length: 32 }).notNull(),
  serverValue: json('server_value'),
  clientValue: json('client_value'),
  serverAuthor: uuid('server_author'),
  clientAuthor: uuid('client_author').notNull(),
  serverChangedAt: stamp('server_changed_at'),
  clientChangedAt: stamp('client_changed_at').notNull(),
  mutationUuid: uuid('mutation_uuid').notNull(),
  status: mysqlEnum('status', ['open', 'resolved']).notNull().default('open'),
  resolution: json('resolution'),
  resolvedBy: uuid('resolved_by'),
  resolvedAt: stamp('resolved_at'),
  version: version().notNull(),
  note: text('note'),
}, t => [
  index('sync_conflicts_shop_version_idx').on(t.shopId, t.version),
  index('sync_conflicts_row_idx').on(t.rowId),
])
