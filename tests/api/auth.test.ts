import { describe, expect, it } from 'vitest'
import { client, DEMO, login } from './helpers/client'
import { sql } from './helpers/db'

const uniqueEmail = (p: string) => `${p}-${Date.now()}-${Math.random().toString(36).slice(2, 7)}@test.example`

describe('register, login, me, logout', () => {
  it('registers, reads me, signs out, and signs back in', async () => {
    const c = client()
    const email = uniqueEmail('reg')
    const reg = await c.post('/api/auth/register', { email, name: 'New Tech', password: 'long-enough-pw' })
    expect(reg.status).toBe(201)
    expect(reg.body.user.email).toBe(email)
    expect(reg.body.memberships).toEqual([])

    const me = await c.get('/api/auth/me')
    expect(me.status).toBe(200)
    expect(me.body.user.name).toBe('New Tech')

    expect((await c.post('/api/auth/logout')).status).toBe(200)
    expect((await c.get('/api/auth/me')).status).toBe(401)

    const again = client()
    const li = await again.post('/api/auth/login', { email: email.toUpperCase(), password: 'long-enough-pw' })
    expect(li.status).toBe(200)
    expect(li.body.user.email).toBe(email)
  })

  it('stores a scrypt hash, never the password', async () => {
    const email = uniqueEmail('hash')
    await client().post('/api/auth/register', { email, name: 'Hash', password: 'long-enough-pw' })
    const [row] = await sql<{ password_hash: string }>('select password_hash from users where email = ?', [email])
    expect(row!.password_hash).toMatch(/^\$scrypt\$/)
    expect(row!.password_hash).not.toContain('long-enough-pw')
  })

  it('refuses short passwords, bad e-mail and duplicates with a message', async () => {
    const short = await client().post('/api/auth/register', { email: uniqueEmail('s'), name: 'S', password: 'short' })
    expect(short.status).toBe(400)
    expect(short.body.message).toMatch(/password/)
    const bad = await client().post('/api/auth/register', { email: 'not-an-email', name: 'S', password: 'long-enough-pw' })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/e-mail/)
    const dup = await client().post('/api/auth/register', { email: DEMO.tech, name: 'Dup', password: 'long-enough-pw' })
    expect(dup.status).toBe(409)
  })

  it('answers 400, never 500, for malformed bodies', async () => {
    for (const path of ['/api/auth/login', '/api/auth/register', '/api/shops']) {
      const c = await login(DEMO.tech)
      for (const body of ['{not json', '[]', '{"email": 5}', 'null']) {
        const r = await c.raw('POST', path, body)
        expect(r.status, `${path} ${body}`).toBe(400)
        expect(typeof r.body.message).toBe('string')
      }
    }
  })

  it('gives one message for a wrong password and an unknown e-mail', async () => {
    const wrong = await client().post('/api/auth/login', { email: DEMO.desk, password: 'definitely-wrong' })
    const unknown = await client().post('/api/auth/login', { email: uniqueEmail('nobody'), password: 'definitely-wrong' })
    expect(wrong.status).toBe(401)
    expect(unknown.status).toBe(401)
    expect(wrong.body.message).toBe(unknown.body.message)
    // A wrong try must not count against the demo account for later tests.
    expect((await client().post('/api/auth/login', { email: DEMO.desk, password: process.env.TW_DEMO_PASSWORD ?? 'tubewright-demo' })).status).toBe(200)
  })

  it('locks an account for 15 minutes on the sixth try after five failures, and audits it', async () => {
    const email = uniqueEmail('lock')
    await client().post('/api/auth/register', { email, name: 'Lock', password: 'the-right-password' })
    for (let i = 0; i < 5; i++) {
      expect((await client().post('/api/auth/login', { email, password: 'wrong-password' })).status).toBe(401)
    }
    const sixth = await client().post('/api/auth/login', { email, password: 'the-right-password' })
    expect(sixth.status).toBe(429)
    const retry = Number(sixth.headers.get('retry-after'))
    expect(retry).toBeGreaterThan(14 * 60)
    expect(retry).toBeLessThanOrEqual(15 * 60)
    const audit = await sql<{ action: string }>('select a.action from audit_log a join users u on u.id = a.user_id where u.email = ? order by a.created_at', [email])
    expect(audit.map(a => a.action)).toContain('auth.lockout')
  })

  it('sets an httpOnly, SameSite=Lax session cookie with a max age (Secure: tests/api/sessions.test.ts)', async () => {
    const r = await fetch(`${process.env.TW_TEST_URL}/api/auth/login`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: DEMO.tech, password: process.env.TW_DEMO_PASSWORD ?? 'tubewright-demo' }),
    })
    const cookie = r.headers.getSetCookie().find(c => c.startsWith('tubewright-session='))!
    expect(cookie).toMatch(/HttpOnly/i)
    expect(cookie).toMatch(/SameSite=Lax/i)
    expect(cookie).toMatch(/Max-Age=\d+|Expires=/i)
  })

  it('signs in every demo account with the demo password', async () => {
    for (const email of [DEMO.owner, DEMO.tech, DEMO.desk, DEMO.dana, DEMO.sam]) {
      const c = await login(email)
      const me = await c.get('/api/auth/me')
      expect(me.body.activeShop.name).toBe('Larkspur Amp Works')
    }
  })
})
