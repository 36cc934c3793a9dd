import { drizzle } from 'drizzle-orm/mysql2'
import { format } from 'mysql2'
import { createPool, type Pool } from 'mysql2/promise'
import * as schema from '../db/schema/index'
import { withRetry } from './transactions'

let pool: Pool | undefined
let instance: ReturnType<typeof makeDb> | undefined

function makeDb(p: Pool) {
  // planetscale mode: MariaDB has no LATERAL joins for relational queries.
  const db = drizzle(p, { schema, mode: 'planetscale' })
  // Every transaction retries deadlocks and (on a Galera cluster) certification conflicts.
  const begin = db.transaction.bind(db)
  db.transaction = ((fn, config) => withRetry(() => begin(fn, config))) as typeof db.transaction
  return db
}

export function useDb() {
  if (!instance) {
    const url = useRuntimeConfig().databaseUrl
    if (!url) throw createError({ statusCode: 503, message: 'The database is not configured.' })
    pool = createPool({
      uri: url, timezone: 'Z', connectionLimit: 20, dateStrings: false,
      // mysql2's own formatting, except that a query with no values is sent as it is: it would
      // otherwise scan the whole text for placeholders (a bulk insert's was most of a push's CPU).
      queryFormat: (sql: string, values: unknown) => (Array.isArray(values) && values.length ? format(sql, values, false, 'Z') : sql),
    })
    instance = makeDb(pool)
  }
  return instance
}

export type Db = ReturnType<typeof useDb>
export type Tx = Parameters<Parameters<Db['transaction']>[0]>[0]
export { schema as tables }
