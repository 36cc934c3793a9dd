import { sql } from 'drizzle-orm'
import { bigint, index, mysqlTable, primaryKey, varchar } from 'drizzle-orm/mysql-core'
import { stamp, uuid } from './columns'

/**
 * Content-addressed files (photos). The bytes live once on disk under their sha256; each shop
 * that uploaded them has its own row, so one shop never reaches another shop's files.
 */
export const blobs = mysqlTable('blobs', {
  sha256: varchar('sha256', { length: 64 }).notNull(),
  shopId: uuid('shop_id').notNull(),
  type: varchar('type', { length: 32 }).notNull(),
  size: bigint('size', { mode: 'number', unsigned: true }).notNull(),
  createdBy: uuid('created_by').notNull(),
  createdAt: stamp('created_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
}, t => [
  primaryKey({ columns: [t.sha256, t.shopId] }),
  index('blobs_shop_idx').on(t.shopId, t.createdAt),
])
