import { createConnection } from 'mysql2/promise'

/** Direct SQL against the throwaway test database, for checks the API does not expose. */
export async function sql<T = any>(query: string, params: unknown[] = []): Promise<T[]> {
  const url = process.env.TW_TEST_DB_URL
  if (!url) throw new Error('TW_TEST_DB_URL is not set (run through npm test)')
  const c = await createConnection({ uri: url, timezone: 'Z' })
  try {
    const [rows] = await c.query(query, params)
    return rows as T[]
  }
  finally {
    await c.end()
  }
}
