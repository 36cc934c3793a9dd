import { sql } from 'drizzle-orm'
import { bigint, datetime, json, varchar } from 'drizzle-orm/mysql-core'

// Shared column helpers: client-generatable UUID keys and UTC millisecond timestamps.
export const uuid = (name: string) => varchar(name, { length: 36 })
export const stamp = (name: string) => datetime(name, { mode: 'date', fsp: 3 })
export const timestamps = () => ({
  createdAt: stamp('created_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  updatedAt: stamp('updated_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`).$onUpdate(() => new Date()),
})

/** Per field: the shop version, client, user and time of its last change (conflict detection). */
export type FieldStamps = Record<string, { v: number, c: string, u: string, at: string }>

/** Columns every field-versioned synced record carries. */
export const synced = () => ({
  id: uuid('id').primaryKey(),
  shopId: uuid('shop_id').notNull(),
  version: bigint('version', { mode: 'number', unsigned: true }).notNull(),
  fieldStamps: json('field_stamps').$type<FieldStamps>().notNull(),
  createdBy: uuid('created_by').notNull(),
  updatedBy: uuid('updated_by'),
  createdAt: stamp('created_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  updatedAt: stamp('updated_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  deletedAt: stamp('deleted_at'),
})
