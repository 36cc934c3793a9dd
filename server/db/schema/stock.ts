import { double, index, int, json, mysqlEnum, mysqlTable, text, tinyint, varchar } from 'drizzle-orm/mysql-core'
import { SET_STATUSES } from '../../../shared/utils/sync/entities'
import { synced, uuid } from './columns'

// Shop tube stock. Readings are SI like the bench engine: volts, amps, siemens.

/** Tubes of one type bought together; the cost is per tube, in minor units. */
export const tubeLots = mysqlTable('tube_lots', {
  ...synced(),
  // A Tubes library id: a built-in id ("6l6gc") or a shop entry's id.
  tubeType: varchar('tube_type', { length: 64 }).notNull(),
  maker: varchar('maker', { length: 120 }).notNull().default(''),
  receivedOn: varchar('received_on', { length: 10 }).notNull().default(''),
  costCents: int('cost_cents').notNull().default(0),
  notes: text('notes').notNull(),
}, t => [
  index('tube_lots_shop_version_idx').on(t.shopId, t.version),
])

/** One tube of a lot, with its reading at a stated test point. */
export const stockTubes = mysqlTable('stock_tubes', {
  ...synced(),
  lotId: uuid('lot_id').notNull(),
  label: varchar('label', { length: 20 }).notNull(),
  plateVolts: double('plate_volts').notNull(),
  gridVolts: double('grid_volts').notNull(),
  amps: double('amps').notNull(),
  transconductance: double('transconductance'),
  testedOn: varchar('tested_on', { length: 10 }).notNull(),
  testedBy: varchar('tested_by', { length: 120 }).notNull().default(''),
  setId: uuid('set_id'),
}, t => [
  index('stock_tubes_shop_version_idx').on(t.shopId, t.version),
  index('stock_tubes_lot_idx').on(t.lotId),
  index('stock_tubes_set_idx').on(t.setId),
])

/** A matched pair or quad; once fitted to a job it has left stock and is a part of that job. */
export const matchedSets = mysqlTable('matched_sets', {
  ...synced(),
  tubeType: varchar('tube_type', { length: 64 }).notNull(),
  label: varchar('label', { length: 20 }).notNull(),
  tubeIds: json('tube_ids').$type<string[]>().notNull(),
  size: tinyint('size').$type<2 | 4>().notNull(),
  spreadFraction: double('spread_fraction').notNull(),
  sorterResultId: uuid('sorter_result_id'),
  status: mysqlEnum('status', SET_STATUSES).notNull().default('in-stock'),
  fittedJobId: uuid('fitted_job_id'),
  fittedAt: varchar('fitted_at', { length: 40 }).notNull().default(''),
  priceCents: int('price_cents'),
}, t => [
  index('matched_sets_shop_version_idx').on(t.shopId, t.version),
  index('matched_sets_shop_status_idx').on(t.shopId, t.status),
  index('matched_sets_job_idx').on(t.fittedJobId),
])
