import { randomUUID } from 'node:crypto'
import { sealSession } from 'h3'
import type { H3Event } from 'h3'
import { afterAll, describe, expect, it } from 'vitest'
import { BASE, client, DEMO, login, newOwner } from './helpers/client'
import { sql } from './helpers/db'
import { secondServer } from './helpers/second-server'

const NAME = 'tubewright-session'
const appEnv = () => JSON.parse(process.env.TW_TEST_APP_ENV ?? '{}') as Record<string, string>

/** A copy of a cookie in another client: what someone who lifted it from a device would hold. */
const copyOf = (cookie: string) => client(BASE, cookie)

function expectSignedOut(r: { status: number, headers: Headers, body: { message?: string } }) {
  expect(r.status).toBe(401)
  expect(r.headers.get('content-type')).toMatch(/application\/json/)
  expect(r.headers.get('location')).toBeNull()
}

async function setCookieOf(base: string) {
  const r = await fetch(`${base}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: DEMO.tech, password: process.env.TW_DEMO_PASSWORD ?? 'tubewright-demo' }),
  })
  expect(r.status).toBe(200)
  return r.headers.getSetCookie().find(c => c.startsWith(`${NAME}=`))!
}

describe('session cookie flags', () => {
  let https: Awaited<ReturnType<typeof secondServer>> | undefined
  afterAll(() => https?.kill())

  it('is HttpOnly and SameSite=Lax with an end date; not Secure while the public origin is plain http', async () => {
    expect(appEnv().NUXT_PUBLIC_ORIGIN).toMatch(/^http:/)
    const cookie = await setCookieOf(BASE)
    expect(cookie).toMatch(/;\s*HttpOnly/i)
    expect(cookie).toMatch(/;\s*SameSite=Lax/i)
    expect(cookie).toMatch(/;\s*(Max-Age=\d+|Expires=)/i)
    expect(cookie).not.toMatch(/;\s*Secure/i)
  })

  it('is Secure when the public origin is https', async () => {
    https = await secondServer({ NUXT_PUBLIC_ORIGIN: 'https://shop.tubewright.example' })
    const cookie = await setCookieOf(https.base)
    expect(cookie).toMatch(/;\s*Secure/i)
    expect(cookie).toMatch(/;\s*HttpOnly/i)
  })
})

describe('server-side sessions', () => {
  it('signing out ends the session on the server: a copy of the cookie no longer works', async () => {
    const c = await login(DEMO.tech)
    const copy = copyOf(c.cookie)
    expect((await copy.get('/api/auth/me')).status).toBe(200)
    expect((await c.post('/api/auth/logout')).status).toBe(200)
    expectSignedOut(await copy.get('/api/auth/me'))
    expectSignedOut(await copy.get('/api/jobs'))
    // A shop route as well as the rigs routes, which read the session themselves.
    expectSignedOut(await copy.get(`/api/shops/${DEMO.shopId}/members`))
    expectSignedOut(await copy.get('/api/rigs'))
  })

  it('a new sign-in on the same device ends the session the cookie had', async () => {
    const c = await login(DEMO.tech)
    const first = c.cookie
    expect((await c.post('/api/auth/login', { email: DEMO.desk, password: process.env.TW_DEMO_PASSWORD ?? 'tubewright-demo' })).status).toBe(200)
    expect((await c.get('/api/auth/me')).body.user.email).toBe(DEMO.desk)
    expectSignedOut(await copyOf(first).get('/api/auth/me'))
  })

  it('keeps one row per signed-in device, stored by hash, never the cookie\'s id', async () => {
    const o = await newOwner('rows')
    await login(o.email, 'correct-horse-battery')
    const rows = await sql<{ id: string }>('select id from sessions where user_id = ?', [o.userId])
    expect(rows).toHaveLength(2)
    for (const r of rows) expect(r.id).toMatch(/^[0-9a-f]{64}$/)
  })

  it('an expired session row answers 401 however young the cookie is', async () => {
    const o = await newOwner('expired')
    expect((await o.c.get('/api/auth/me')).status).toBe(200)
    await sql('update sessions set expires_at = ? where user_id = ?', [new Date(Date.now() - 1000), o.userId])
    expectSignedOut(await o.c.get('/api/auth/me'))
  })

  it('answers 401 (never 500) to a cookie with one byte changed, and to one that is not a sealed session', async () => {
    const c = await login(DEMO.tech)
    const value = c.cookie.slice(NAME.length + 1)
    for (const at of [10, Math.floor(value.length / 2), value.length - 3]) {
      const flipped = value.slice(0, at) + (value[at] === 'A' ? 'B' : 'A') + value.slice(at + 1)
      expectSignedOut(await copyOf(`${NAME}=${flipped}`).get('/api/auth/me'))
    }
    expectSignedOut(await copyOf(`${NAME}=garbage`).get('/api/jobs'))
    expectSignedOut(await copyOf(`${NAME}=${'%'.repeat(5)}`).get('/api/auth/me'))
    // The untouched cookie still works.
    expect((await c.get('/api/auth/me')).status).toBe(200)
  })

  it('treats a valid cookie from before sessions were kept (no session id) as signed out', async () => {
    const o = await newOwner('legacy')
    const password = appEnv().NUXT_SESSION_PASSWORD!
    const event = { context: { sessions: { [NAME]: { id: randomUUID(), createdAt: Date.now(), data: { user: { id: o.userId }, activeShopId: o.shopId } } } } } as unknown as H3Event
    const sealed = await sealSession(event, { name: NAME, password })
    const legacy = copyOf(`${NAME}=${sealed}`)
    const me = await legacy.get('/api/auth/me')
    expectSignedOut(me)
    expect(me.body.message).toBe('Sign in first.')
    // The user's real session (from registering) is not touched by the refusal.
    expect((await o.c.get('/api/auth/me')).status).toBe(200)
    // Signing in again from that device works and replaces the old cookie.
    const again = await legacy.post('/api/auth/login', { email: o.email, password: 'correct-horse-battery' })
    expect(again.status).toBe(200)
    expect((await legacy.get('/api/auth/me')).status).toBe(200)
  })
})

describe('POST /api/auth/password', () => {
  it('changes the password, ends every other session of the user and keeps this one', async () => {
    const o = await newOwner('pw')
    const phone = await login(o.email, 'correct-horse-battery')
    const laptop = await login(o.email, 'correct-horse-battery')
    const other = await login(DEMO.tech)
    const r = await o.c.post('/api/auth/password', { currentPassword: 'correct-horse-battery', newPassword: 'a-new-long-password' })
    expect(r.status).toBe(200)
    expect(r.body).toEqual({ ok: true, endedSessions: 2 })
    expect((await o.c.get('/api/auth/me')).status).toBe(200)
    expectSignedOut(await phone.get('/api/auth/me'))
    expectSignedOut(await laptop.get('/api/auth/me'))
    // Someone else's session is untouched.
    expect((await other.get('/api/auth/me')).status).toBe(200)
    expect((await client().post('/api/auth/login', { email: o.email, password: 'correct-horse-battery' })).status).toBe(401)
    expect((await client().post('/api/auth/login', { email: o.email, password: 'a-new-long-password' })).status).toBe(200)
    const audit = await sql<{ action: string }>('select action from audit_log where user_id = ? and action = ?', [o.userId, 'auth.password-change'])
    expect(audit).toHaveLength(1)
  })

  it('refuses a wrong current password (403) and changes nothing', async () => {
    const o = await newOwner('pw-wrong')
    const phone = await login(o.email, 'correct-horse-battery')
    const r = await o.c.post('/api/auth/password', { currentPassword: 'not-the-password', newPassword: 'a-new-long-password' })
    expect(r.status).toBe(403)
    expect(r.body.message).toBe('The current password is wrong.')
    expect((await phone.get('/api/auth/me')).status).toBe(200)
    expect((await client().post('/api/auth/login', { email: o.email, password: 'correct-horse-battery' })).status).toBe(200)
  })

  it('answers 400 with a sentence for a short, missing or unchanged new password, and 401 signed out', async () => {
    const o = await newOwner('pw-bad')
    const short = await o.c.post('/api/auth/password', { currentPassword: 'correct-horse-battery', newPassword: 'short' })
    expect(short.status).toBe(400)
    expect(short.body.message).toMatch(/at least 10 characters/)
    expect((await o.c.post('/api/auth/password', { currentPassword: 'correct-horse-battery' })).status).toBe(400)
    const same = await o.c.post('/api/auth/password', { currentPassword: 'correct-horse-battery', newPassword: 'correct-horse-battery' })
    expect(same.status).toBe(400)
    expect(same.body.message).toMatch(/different/)
    expect((await o.c.raw('POST', '/api/auth/password', '{not json')).status).toBe(400)
    expectSignedOut(await client().post('/api/auth/password', { currentPassword: 'x', newPassword: 'a-new-long-password' }))
  })
})
