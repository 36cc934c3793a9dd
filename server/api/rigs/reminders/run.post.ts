import { timingSafeEqual } from 'node:crypto'
import { z } from 'zod'

// Runs the reminder task now, for the test stack and operators: only with the secret from runtime
// config (NUXT_RIG_REMINDER_SECRET); with none configured the route does not exist.
const body = z.object({
  today: z.iso.date({ message: 'use a date like 2026-12-08' }).optional(),
  userId: z.uuid({ message: 'must be an id' }).optional(),
})

export default defineEventHandler(async (event) => {
  const secret = useRuntimeConfig().rigReminderSecret
  const given = getHeader(event, 'x-task-secret') ?? ''
  const ok = !!secret && given.length === secret.length && timingSafeEqual(Buffer.from(given), Buffer.from(secret))
  if (!ok) throw createError({ statusCode: 404, message: 'Not found.' })
  const { today, userId } = await validBody(event, body)
  return withRetry(() => sendRetubeReminders(today ?? utcToday(), userId))
})
