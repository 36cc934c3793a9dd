// A small HTTP client with a cookie jar, for API tests against the running server.
export const BASE = process.env.TW_TEST_URL ?? 'http://localhost:3000'
export const DEMO_PASSWORD = process.env.TW_DEMO_PASSWORD ?? 'tubewright-demo'

export interface Reply<T = any> { status: number, body: T, headers: Headers }

export function client(base = BASE, initialCookie = '') {
  let cookie = initialCookie
  async function call<T = any>(method: string, path: string, body?: unknown): Promise<Reply<T>> {
    const res = await fetch(base + path, {
      method,
      headers: { ...(body !== undefined ? { 'content-type': 'application/json' } : {}), ...(cookie ? { cookie } : {}) },
      body: body === undefined ? undefined : typeof body === 'string' ? body : JSON.stringify(body),
      redirect: 'manual',
    })
    const set = res.headers.getSetCookie().find(c => c.startsWith('tubewright-session='))
    if (set) cookie = set.split(';')[0]!
    const text = await res.text()
    let parsed: any = text
    try {
      parsed = JSON.parse(text)
    }
    catch { /* not JSON */ }
    return { status: res.status, body: parsed as T, headers: res.headers }
  }
  return {
    get: <T = any>(p: string) => call<T>('GET', p),
    post: <T = any>(p: string, b?: unknown) => call<T>('POST', p, b ?? {}),
    put: <T = any>(p: string, b?: unknown) => call<T>('PUT', p, b),
    patch: <T = any>(p: string, b?: unknown) => call<T>('PATCH', p, b ?? {}),
    del: <T = any>(p: string) => call<T>('DELETE', p),
    raw: call,
    get cookie() { return cookie },
    set cookie(value: string) { cookie = value },
  }
}

export type Client = ReturnType<typeof client>

export async function login(email: string, password = DEMO_PASSWORD): Promise<Client> {
  const c = client()
  const r = await c.post('/api/auth/login', { email, password })
  if (r.status !== 200) throw new Error(`login ${email} answered ${r.status}: ${JSON.stringify(r.body)}`)
  return c
}

let n = 0
/** A brand-new user with a shop of their own (owner). */
export async function newOwner(prefix = 'owner') {
  const c = client()
  const email = `${prefix}-${Date.now()}-${process.pid}-${n++}@test.example`
  const r = await c.post('/api/auth/register', { email, name: `Test ${prefix}`, password: 'correct-horse-battery' })
  if (r.status !== 201) throw new Error(`register answered ${r.status}`)
  const s = await c.post('/api/shops', { name: `Test shop ${n}` })
  if (s.status !== 201) throw new Error(`create shop answered ${s.status}`)
  return { c, email, userId: r.body.user.id as string, shopId: s.body.activeShop.id as string }
}

export const DEMO = {
  shopId: '6f1c2a10-0000-4000-8000-000000000001',
  owner: 'owner@larkspur.example',
  tech: 'tech@larkspur.example',
  desk: 'desk@larkspur.example',
  dana: 'dana@players.example',
  sam: 'sam@players.example',
}

/** Another shop for isolation tests: its owner's client, e-mail and shop id. */
export async function ownerOfNewShop() {
  const o = await newOwner('elsewhere')
  return { client: o.c, email: o.email, shopId: o.shopId }
}
