import { defineConfig } from 'drizzle-kit'

export default defineConfig({
  dialect: 'mysql',
  schema: './server/db/schema/index.ts',
  out: './drizzle',
  dbCredentials: { url: process.env.NUXT_DATABASE_URL || 'mysql://tubewright@127.0.0.1:3307/tubewright' },
})
