import { bigint, index, json, mysqlEnum, mysqlTable, text, varchar } from 'drizzle-orm/mysql-core'
import { sql } from 'drizzle-orm'
import { stamp, uuid } from './columns'

/** Per field: the shop version and client of its last change (conflict detection). */
export type FieldStamps = Record<string, { v: number, c: string, u: string, at: string }>

const syncColumns = () => ({
  shopId: uuid('shop_id').notNull(),
  authorId: uuid('author_id').notNull(),
  version: bigint('version', { mode: 'number', unsigned: true }).notNull(),
  createdAt: stamp('created_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  updatedAt: stamp('updated_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  deletedAt: stamp('deleted_at'),
})

export const notes = mysqlTable('notes', {
  id: uuid('id').primaryKey(),
  jobId: uuid('job_id'),
  title: varchar('title', { length: 200 }).notNull().default(''),
  body: text('body').notNull(),
  // Job notes: internal to the shop, or shown to the customer.
  visibility: mysqlEnum('visibility', ['internal', 'customer']).notNull().default('internal'),
  fieldStamps: json('field_stamps').$type<FieldStamps>().notNull(),
  updatedBy: uuid('updated_by'),
  ...syncColumns(),
}, t => [
  index('notes_shop_version_idx').on(t.shopId, t.version),
  index('notes_job_idx').on(t.jobId),
])

export const measurements = mysqlTable('measurements', {
  id: uuid('id').primaryKey(),
  jobId: uuid('job_id'),
  rigId: uuid('rig_id'),
  tool: varchar('tool', { length: 32 }).notNull(),
  inputs: json('inputs').$type<Record<string, unknown>>().notNull(),
  outputs: json('outputs').$type<Record<string, unknown>>().notNull(),
  engineVersion: varchar('engine_version', { length: 20 }).notNull(),
  label: varchar('label', { length: 200 }),
  ...syncColumns(),
}, t => [
  index('measurements_shop_version_idx').on(t.shopId, t.version),
  index('measurements_job_idx').on(t.jobId),
])
