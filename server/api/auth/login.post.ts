import { eq } from 'drizzle-orm'
import { loginSchema } from '#shared/utils/schemas/auth'

const WINDOW_MS = 15 * 60_000
const LOCK_MS = 15 * 60_000
const MAX_FAILURES = 5
const WRONG = 'Wrong e-mail or password.'
// Verified when the e-mail is unknown, so both paths take about as long.
let dummyHash: Promise<string> | undefined

export default defineEventHandler(async (event) => {
  const { email, password } = await validBody(event, loginSchema)
  const db = useDb()
  const [user] = await db.select().from(tables.users).where(eq(tables.users.email, email)).limit(1)
  if (!user || user.deletedAt) {
    dummyHash ??= hashPassword('not-a-real-password')
    await verifyPassword(await dummyHash, password)
    throw createError({ statusCode: 401, message: WRONG })
  }

  const now = Date.now()
  if (user.lockedUntil && user.lockedUntil.getTime() > now) {
    const retryAfter = Math.ceil((user.lockedUntil.getTime() - now) / 1000)
    setResponseHeader(event, 'Retry-After', retryAfter)
    await audit(db, { userId: user.id, action: 'auth.locked-attempt' })
    throw createError({ statusCode: 429, message: `Too many failed sign-ins. Try again in ${Math.ceil(retryAfter / 60)} minutes.` })
  }

  if (!(await verifyPassword(user.passwordHash, password))) {
    await db.transaction(async (tx) => {
      const [row] = await tx.select().from(tables.users).where(eq(tables.users.id, user.id)).for('update')
      if (!row) return
      const fresh = !row.firstFailedAt || now - row.firstFailedAt.getTime() > WINDOW_MS
      const failedLogins = fresh ? 1 : row.failedLogins + 1
      const lock = failedLogins >= MAX_FAILURES
      await tx.update(tables.users).set({
        failedLogins: lock ? 0 : failedLogins,
        firstFailedAt: lock ? null : fresh ? new Date(now) : row.firstFailedAt,
        lockedUntil: lock ? new Date(now + LOCK_MS) : row.lockedUntil,
      }).where(eq(tables.users.id, user.id))
      await audit(tx, { userId: user.id, action: lock ? 'auth.lockout' : 'auth.failed', detail: { failedLogins } })
    })
    throw createError({ statusCode: 401, message: WRONG })
  }

  if (user.failedLogins || user.lockedUntil) {
    await db.update(tables.users).set({ failedLogins: 0, firstFailedAt: null, lockedUntil: null }).where(eq(tables.users.id, user.id))
  }
  const me = await loadMe(user.id)
  await startSession(event, user.id, me?.activeShop?.id ?? null)
  await audit(db, { userId: user.id, action: 'auth.login' })
  return me
})
