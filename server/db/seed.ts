// Seeds the demo shop; safe to run again (fixed ids, upserts, passwords only set once).
import { drizzle } from 'drizzle-orm/mysql2'
import { createPool } from 'mysql2/promise'
import { Hash } from '@adonisjs/hash'
import { Scrypt } from '@adonisjs/hash/drivers/scrypt'
import { sql } from 'drizzle-orm'
import * as schema from './schema/index'
import { DEMO_SHOP, DEMO_USERS } from './demo'

const url = process.env.NUXT_DATABASE_URL
if (!url) {
  console.error('NUXT_DATABASE_URL is not set.')
  process.exit(1)
}
const password = process.env.TW_DEMO_PASSWORD || 'tubewright-demo'
// Same scrypt defaults as nuxt-auth-utils' hashPassword, so the server verifies these hashes.
const hash = new Hash(new Scrypt({}))

const pool = createPool({ uri: url, timezone: 'Z', connectionLimit: 2 })
const db = drizzle(pool, { schema, mode: 'planetscale' })
try {
  const passwordHash = await hash.make(password)
  await db.transaction(async (tx) => {
    await tx.insert(schema.shops).values(DEMO_SHOP).onDuplicateKeyUpdate({ set: { name: DEMO_SHOP.name } })
    for (const u of DEMO_USERS) {
      await tx.insert(schema.users).values({ id: u.id, email: u.email, name: u.name, passwordHash })
        .onDuplicateKeyUpdate({ set: { name: u.name } })
      await tx.insert(schema.memberships).values({ shopId: DEMO_SHOP.id, userId: u.id, role: u.role })
        .onDuplicateKeyUpdate({ set: { role: sql`role` } })
    }
  })
  console.log(`[tubewright] Demo shop "${DEMO_SHOP.name}" seeded.`)
}
finally {
  await pool.end()
}
