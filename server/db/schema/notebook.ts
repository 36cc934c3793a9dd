import { index, json, mysqlEnum, mysqlTable, text, varchar } from 'drizzle-orm/mysql-core'
import { NOTE_VISIBILITY } from '../../../shared/utils/sync/entities'
import { synced, uuid, type FieldStamps } from './columns'
import type { BenchToolId } from '../../../shared/utils/bench/tool-schemas'

export const notes = mysqlTable('notes', {
  ...synced(),
  jobId: uuid('job_id'),
  title: varchar('title', { length: 200 }).notNull().default(''),
  body: text('body').notNull(),
  // Job notes: internal to the shop, or shown to the customer.
  visibility: mysqlEnum('visibility', NOTE_VISIBILITY).notNull().default('internal'),
}, t => [
  index('notes_shop_version_idx').on(t.shopId, t.version),
  index('notes_job_idx').on(t.jobId),
])

/** A saved bench result: insert-only, recomputed by the server before it is taken. */
export const measurements = mysqlTable('measurements', {
  ...synced(),
  // Results saved before they were ordinary records have no stamps: an empty set.
  fieldStamps: json('field_stamps').$type<FieldStamps>().notNull().default({}),
  jobId: uuid('job_id'),
  rigId: uuid('rig_id'),
  tool: varchar('tool', { length: 32 }).$type<BenchToolId>().notNull(),
  inputs: json('inputs').$type<Record<string, unknown>>().notNull(),
  outputs: json('outputs').$type<Record<string, unknown>>().notNull(),
  engineVersion: varchar('engine_version', { length: 20 }).notNull(),
  label: varchar('label', { length: 200 }),
}, t => [
  index('measurements_shop_version_idx').on(t.shopId, t.version),
  index('measurements_job_idx').on(t.jobId),
])
