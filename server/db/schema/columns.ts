import { sql } from 'drizzle-orm'
import { datetime, varchar } from 'drizzle-orm/mysql-core'

// Shared column helpers: client-generatable UUID keys and UTC millisecond timestamps.
export const uuid = (name: string) => varchar(name, { length: 36 })
export const stamp = (name: string) => datetime(name, { mode: 'date', fsp: 3 })
export const timestamps = () => ({
  createdAt: stamp('created_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`),
  updatedAt: stamp('updated_at').notNull().default(sql`CURRENT_TIMESTAMP(3)`).$onUpdate(() => new Date()),
})
