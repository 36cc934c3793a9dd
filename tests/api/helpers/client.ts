// A tiny fetch client with a cookie jar, for API tests against the running server.
import { randomUUID } from 'node:crypto'

// A reply body is whatever JSON the route sent; tests read its fields directly.
// eslint-disable-next-line @typescript-eslint/no-explicit-any
type Json = any

export interface Reply<T = Json> {
  status: number
  body: T
}

export interface Client {
  get: <T = Json>(path: string) => Promise<Reply<T>>
  post: <T = Json>(path: string, body?: unknown) => Promise<Reply<T>>
  patch: <T = Json>(path: string, body?: unknown) => Promise<Reply<T>>
  del: <T = Json>(path: string) => Promise<Reply<T>>
}

export const SESSION_COOKIE = 'tubewright-session'

export function baseUrl(): string {
  const url = process.env.TW_TEST_URL
  if (!url) throw new Error('TW_TEST_URL is not set: run the API tests through npm test (scripts/test.mjs).')
  return url.replace(/\/$/, '')
}

/** A client with its own cookie jar; signed out until it logs in. */
export function client(): Client & { jar: Map<string, string> } {
  const jar = new Map<string, string>()
  async function send(method: string, path: string, body?: unknown): Promise<Reply> {
    const headers: Record<string, string> = { accept: 'application/json' }
    if (jar.size) headers.cookie = [...jar].map(([k, v]) => `${k}=${v}`).join('; ')
    if (body !== undefined) headers['content-type'] = 'application/json'
    const res = await fetch(`${baseUrl()}${path}`, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
      redirect: 'manual',
    })
    for (const line of res.headers.getSetCookie()) {
      const [pair = ''] = line.split(';')
      const eq = pair.indexOf('=')
      const name = pair.slice(0, eq).trim()
      const value = pair.slice(eq + 1).trim()
      if (/max-age=0|expires=thu, 01 jan 1970/i.test(line) || value === '') jar.delete(name)
      else jar.set(name, value)
    }
    const text = await res.text()
    let parsed: unknown = text
    try {
      parsed = text ? JSON.parse(text) : null
    }
    catch { /* not JSON: keep the text */ }
    return { status: res.status, body: parsed }
  }
  return {
    jar,
    get: path => send('GET', path),
    post: (path, body) => send('POST', path, body ?? {}),
    patch: (path, body) => send('PATCH', path, body ?? {}),
    del: path => send('DELETE', path),
  }
}

/** Signs in (demo password by default) and returns the signed-in client. */
export async function login(email: string, password = process.env.TW_DEMO_PASSWORD ?? 'tubewright-demo') {
  const c = client()
  const r = await c.post('/api/auth/login', { email, password })
  if (r.status !== 200) throw new Error(`login ${email}: ${r.status} ${JSON.stringify(r.body)}`)
  if (!c.jar.has(SESSION_COOKIE)) throw new Error(`login ${email}: no ${SESSION_COOKIE} cookie`)
  return c
}

/** A fresh user who owns a fresh shop: "another shop" for isolation tests. */
export async function ownerOfNewShop() {
  const c = client()
  const tag = randomUUID().slice(0, 8)
  const email = `owner-${tag}@elsewhere.example`
  const reg = await c.post('/api/auth/register', { email, name: `Test Owner ${tag}`, password: `pw-${tag}-long-enough` })
  if (reg.status !== 201) throw new Error(`register: ${reg.status} ${JSON.stringify(reg.body)}`)
  const shop = await c.post('/api/shops', { name: `Bench Test Shop ${tag}` })
  if (shop.status !== 201) throw new Error(`create shop: ${shop.status} ${JSON.stringify(shop.body)}`)
  return { client: c, email, shopId: shop.body.activeShop.id as string }
}
