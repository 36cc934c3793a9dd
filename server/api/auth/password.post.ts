import { eq } from 'drizzle-orm'
import { passwordChangeSchema } from '#shared/utils/schemas/auth'

/** Change the password; every other signed-in device is signed out, this one stays. */
export default defineEventHandler(async (event) => {
  const userId = await requireUserId(event)
  const { currentPassword, newPassword } = await validBody(event, passwordChangeSchema)
  const sid = (await getUserSession(event)).secure?.sid
  if (!sid) throw createError({ statusCode: 401, message: 'Sign in first.' })
  const db = useDb()
  const [user] = await db.select({ passwordHash: tables.users.passwordHash }).from(tables.users).where(eq(tables.users.id, userId)).limit(1)
  if (!user) throw createError({ statusCode: 401, message: 'Sign in first.' })
  if (!(await verifyPassword(user.passwordHash, currentPassword))) {
    await audit(db, { userId, action: 'auth.password-wrong' })
    throw createError({ statusCode: 403, message: 'The current password is wrong.' })
  }
  const passwordHash = await hashPassword(newPassword)
  const endedSessions = await db.transaction(async (tx) => {
    await tx.update(tables.users).set({ passwordHash }).where(eq(tables.users.id, userId))
    const ended = await endOtherSessions(tx, userId, sid)
    await audit(tx, { userId, action: 'auth.password-change', detail: { endedSessions: ended } })
    return ended
  })
  return { ok: true, endedSessions }
})
