import type { H3Event } from 'h3'
import { randomUUID } from 'node:crypto'
import { and, eq, lt, ne, sql } from 'drizzle-orm'
import { cookieSecure } from './cookie-flags'

// Every session write goes through here so the cookie flags are the same on each Set-Cookie.
function sessionConfig(event: H3Event) {
  const config = useRuntimeConfig(event)
  return { cookie: { secure: cookieSecure(config.publicOrigin, config.cookieSecure) } }
}

const sessionName = (event: H3Event) => useRuntimeConfig(event).session.name || 'nuxt-session'

/**
 * Expire the cookie and let the rest of this request run signed out. h3 would otherwise read the
 * request's cookie again on the next session call, so the request's session is replaced too.
 */
async function forgetSession(event: H3Event) {
  await clearUserSession(event, sessionConfig(event))
  event.context.sessions ??= Object.create(null)
  event.context.sessions![sessionName(event)] = { id: randomUUID(), createdAt: Date.now(), data: Object.create(null) }
}

export async function deleteSessionRow(sid: string | undefined) {
  if (sid) await useDb().delete(tables.sessions).where(eq(tables.sessions.id, hashToken(sid)))
}

// Built once: this lookup runs on every signed-in request.
let liveLookup: ReturnType<typeof prepareLiveLookup> | undefined
const prepareLiveLookup = () => useDb().select({ userId: tables.sessions.userId, expiresAt: tables.sessions.expiresAt })
  .from(tables.sessions).where(eq(tables.sessions.id, sql.placeholder('id'))).limit(1).prepare()

/** Is this cookie's session still on the server? One primary-key lookup. */
export async function sessionIsLive(userId: string, sid: string | undefined): Promise<boolean> {
  if (!sid) return false
  liveLookup ??= prepareLiveLookup()
  const [row] = await withRetry(() => liveLookup!.execute({ id: hashToken(sid) }))
  return !!row && row.userId === userId && row.expiresAt.getTime() > Date.now()
}

// Unsealing a cookie (two key derivations, an HMAC and a decryption) cost more than the rest of
// a signed-in request's checks. The same sealed text always opens to the same session, so what a
// cookie opened to is kept for a minute. Only the opening is skipped: the row in `sessions` is
// still read on every request, so a sign-out or a password change ends the session at once.
const OPENED_FOR_MS = 60_000
const OPENED_MAX = 5000
type OpenedSession = { id: string, createdAt: number, data: Record<string, unknown> }
const opened = new Map<string, { at: number, session: OpenedSession }>()

async function openSession(event: H3Event, name: string, sealed: string) {
  const hit = opened.get(sealed)
  const fresh = !!hit && Date.now() - hit.at < OPENED_FOR_MS
  if (fresh) {
    event.context.sessions ??= Object.create(null)
    event.context.sessions![name] = structuredClone(hit!.session)
  }
  const session = await getUserSession(event)
  const read = event.context.sessions?.[name] as OpenedSession | undefined
  if (!fresh && session.user && read?.id) {
    opened.delete(sealed)
    if (opened.size >= OPENED_MAX) opened.delete(opened.keys().next().value!)
    opened.set(sealed, { at: Date.now(), session: structuredClone({ id: read.id, createdAt: read.createdAt, data: read.data }) })
  }
  return session
}

/** The check every /api request with a session cookie passes (server/middleware/session.ts). */
export async function dropEndedSession(event: H3Event) {
  const name = sessionName(event)
  const sealed = getCookie(event, name)
  if (!sealed) return
  const session = await openSession(event, name, sealed)
  if (!session.user) return
  if (!(await sessionIsLive(session.user.id, session.secure?.sid))) await forgetSession(event)
}

/** Sign in on this device: a new server-side session, and a fresh cookie for it. */
export async function startSession(event: H3Event, userId: string, activeShopId: string | null) {
  const db = useDb()
  const now = Date.now()
  const sid = newToken()
  await db.delete(tables.sessions).where(and(eq(tables.sessions.userId, userId), lt(tables.sessions.expiresAt, new Date(now))))
  const maxAge = useRuntimeConfig(event).session.maxAge ?? 60 * 60 * 24 * 30
  await db.insert(tables.sessions).values({ id: hashToken(sid), userId, expiresAt: new Date(now + maxAge * 1000) })
  // Ends the session this cookie had before (the clear hook deletes its row).
  await forgetSession(event)
  await setUserSession(event, { user: { id: userId }, activeShopId, secure: { sid } }, sessionConfig(event))
}

/** The shop switcher: same session, another active shop. */
export async function setSessionShop(event: H3Event, shopId: string) {
  await setUserSession(event, { activeShopId: shopId }, sessionConfig(event))
}

/** Sign out here: the server forgets the session (server/plugins/sessions.ts), so a copy of the cookie stops working too. */
export async function endSession(event: H3Event) {
  await forgetSession(event)
}

/** After a password change: every other device of this user is signed out. */
export async function endOtherSessions(db: Db | Tx, userId: string, keepSid: string) {
  const [result] = await db.delete(tables.sessions)
    .where(and(eq(tables.sessions.userId, userId), ne(tables.sessions.id, hashToken(keepSid))))
  return result.affectedRows
}
