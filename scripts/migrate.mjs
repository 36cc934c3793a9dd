// Applies drizzle/ migrations with the programmatic migrator (it prints the real error,
// unlike drizzle-kit migrate on MariaDB).
import { drizzle } from 'drizzle-orm/mysql2'
import { migrate } from 'drizzle-orm/mysql2/migrator'
import { createPool } from 'mysql2/promise'
import { readEnvFile } from './lib/env.mjs'

export async function runMigrations(url) {
  const pool = createPool({ uri: url, timezone: 'Z', connectionLimit: 1 })
  try {
    await migrate(drizzle(pool), { migrationsFolder: 'drizzle' })
  }
  finally {
    await pool.end()
  }
}

if (import.meta.url === `file://${process.argv[1]}`) {
  const url = process.env.NUXT_DATABASE_URL || readEnvFile('.env').NUXT_DATABASE_URL
  if (!url) {
    console.error('NUXT_DATABASE_URL is not set (run npm start once to write .env).')
    process.exit(1)
  }
  runMigrations(url).then(() => console.log('Migrations applied.'), (e) => {
    console.error('Migration failed:', e.message)
    process.exit(1)
  })
}
