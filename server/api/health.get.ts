import { sql } from 'drizzle-orm'

export default defineEventHandler(async () => {
  try {
    await useDb().execute(sql`select 1`)
  }
  catch {
    throw createError({ statusCode: 503, message: 'The database is not answering.' })
  }
  return { ok: true }
})
