import { relations } from 'drizzle-orm'
import { double, index, mysqlEnum, mysqlTable, text, varchar } from 'drizzle-orm/mysql-core'
import { RATING_SYSTEMS } from '../../../shared/utils/schemas/tubes'
import { shops } from './auth'
import { stamp, timestamps, uuid } from './columns'

// A shop's own tube-library entries; the built-in ones live in code (shared/utils/tubes).
// Ratings are physical quantities, not money, so doubles are fine here.
export const tubes = mysqlTable('tubes', {
  id: uuid('id').primaryKey(),
  shopId: uuid('shop_id').notNull().references(() => shops.id),
  name: varchar('name', { length: 80 }).notNull(),
  maxPlateWatts: double('max_plate_watts').notNull(),
  maxScreenWatts: double('max_screen_watts'),
  maxPlateVolts: double('max_plate_volts').notNull(),
  heater: varchar('heater', { length: 60 }).notNull(),
  ratingSystem: mysqlEnum('rating_system', RATING_SYSTEMS).notNull(),
  source: text('source').notNull(),
  ...timestamps(),
  /** Retired: kept for saved results that name it, hidden from the library. */
  deletedAt: stamp('deleted_at'),
}, t => [index('tubes_shop_idx').on(t.shopId, t.deletedAt)])

export const tubesRelations = relations(tubes, ({ one }) => ({
  shop: one(shops, { fields: [tubes.shopId], references: [shops.id] }),
}))

export type TubeRow = typeof tubes.$inferSelect
export type NewTubeRow = typeof tubes.$inferInsert
