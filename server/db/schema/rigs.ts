import { boolean, double, index, json, mysqlEnum, mysqlTable, text, uniqueIndex, varchar } from 'drizzle-orm/mysql-core'
import { sql } from 'drizzle-orm'
import type { RigReading, RigTube } from '../../../shared/utils/rigs/types'
import { stamp, synced, uuid } from './columns'

// A player's own records: they live in the player's personal space (shops.kind = 'personal'),
// whether or not the player belongs to any shop.

export const rigs = mysqlTable('rigs', {
  ...synced(),
  description: varchar('description', { length: 200 }).notNull(),
  serial: varchar('serial', { length: 80 }).notNull().default(''),
  tubes: json('tubes').$type<RigTube[]>().notNull(),
  biasMode: mysqlEnum('bias_mode', ['fixed', 'cathode']).notNull().default('fixed'),
  speakerLoadOhms: double('speaker_load_ohms'),
  outputTapOhms: double('output_tap_ohms'),
  retubeHours: double('retube_hours'),
  retubeMonths: double('retube_months'),
  notes: text('notes').notNull(),
}, t => [
  index('rigs_shop_version_idx').on(t.shopId, t.version),
])

export const rigTubeSets = mysqlTable('rig_tube_sets', {
  ...synced(),
  rigId: uuid('rig_id').notNull(),
  fittedOn: varchar('fitted_on', { length: 10 }).notNull().default(''),
  fittedBy: varchar('fitted_by', { length: 120 }).notNull().default(''),
  tubes: json('tubes').$type<RigTube[]>().notNull(),
  readings: json('readings').$type<RigReading[]>().notNull(),
  spare: boolean('spare').notNull().default(false),
  retiredOn: varchar('retired_on', { length: 10 }).notNull().default(''),
}, t => [
  index('rig_tube_sets_shop_version_idx').on(t.shopId, t.version),
  index('rig_tube_sets_rig_idx').on(t.rigId),
])

export const rigGigs = mysqlTable('rig_gigs', {
  ...synced(),
  rigId: uuid('rig_id').notNull(),
  playedOn: varchar('played_on', { length: 10 }).notNull(),
  hours: double('hours').notNull(),
  note: varchar('note', { length: 200 }).notNull().default(''),
}, t => [
  index('rig_gigs_shop_version_idx').on(t.shopId, t.version),
  index('rig_gigs_rig_idx').on(t.rigId),
])

/** A rig shown to a shop; deleting the row revokes it. */
export const rigShares = mysqlTable('rig_shares', {
  ...synced(),
  rigId: uuid('rig_id').notNull(),
  sharedShopId: uuid('shared_shop_id').notNull(),
}, t => [
  index('rig_shares_shop_version_idx').on(t.shopId, t.version),
  index('rig_shares_rig_idx').on(t.rigId),
  index('rig_shares_shared_idx').on(t.sharedShopId),
])

/** Retube thresholds a shop suggests for a rig shared with it (kept in the shop, not the player's space). */
export const rigSuggestions = mysqlTable('rig_suggestions', {
  ...synced(),
  rigId: uuid('rig_id').notNull(),
  retubeHours: double('retube_hours'),
  retubeMonths: double('retube_months'),
  note: varchar('note', { length: 200 }).notNull().default(''),
  // The suggester's name as the server knows it (written by the server, whatever was sent).
  suggestedBy: varchar('suggested_by', { length: 120 }).notNull().default(''),
}, t => [
  index('rig_suggestions_shop_version_idx').on(t.shopId, t.version),
  index('rig_suggestions_rig_idx').on(t.rigId),
])

/** Retube reminders already e-mailed: one per threshold per fitted set. */
export const rigReminders = mysqlTable('rig_reminders', {
  setId: uuid('set_id').notNull(),
  threshold: mysqlEnum('threshold', ['hours', 'months']).notNull(),
  rigId: uuid('rig_id').notNull(),
  userId: uuid('user_id').notNull(),
  sentAt: stamp('sent_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
}, t => [
  uniqueIndex('rig_reminders_set_threshold_uq').on(t.setId, t.threshold),
])
