import { createHash } from 'node:crypto'
import { beforeAll, describe, expect, it } from 'vitest'
import { BASE, DEMO, login, type Client } from './helpers/client'

interface Seen { path: string, status: number, type: string, headers: Headers, body: string }

async function fetchRaw(path: string, init: RequestInit = {}): Promise<Seen> {
  const r = await fetch(BASE + path, { redirect: 'manual', ...init })
  return { path, status: r.status, type: r.headers.get('content-type') ?? '', headers: r.headers, body: await r.text() }
}

function directives(csp: string | null) {
  expect(csp, 'content-security-policy').toBeTruthy()
  return new Map(csp!.split(';').map(d => d.trim()).filter(Boolean).map((d) => {
    const [name, ...values] = d.split(/\s+/)
    return [name!, values]
  }))
}

/** A thrown error carries the framework's error policy (no script at all); every other answer the app's. */
function expectSecurityHeaders(r: Seen) {
  const d = directives(r.headers.get('content-security-policy'))
  const errorPolicy = r.status >= 400 && d.get('script-src')?.join(' ') === `'none'`
  if (!errorPolicy) expect(d.get('default-src'), r.path).toEqual([`'self'`])
  expect(d.get('frame-ancestors'), r.path).toEqual([`'none'`])
  expect(d.get('script-src'), r.path).not.toContain(`'unsafe-inline'`)
  expect(d.get('script-src'), r.path).not.toContain(`'unsafe-eval'`)
  expect(r.headers.get('x-content-type-options'), r.path).toBe('nosniff')
  expect(r.headers.get('referrer-policy'), r.path).toBe('no-referrer')
}

let tech: Client
let shell: Seen
beforeAll(async () => {
  tech = await login(DEMO.tech)
  shell = await fetchRaw('/', { headers: { 'accept-encoding': 'identity' } })
})

describe('security headers on every kind of response', () => {
  it('the prerendered shell, with a hash in script-src for each inline script it runs, however it is compressed', async () => {
    // The shell is also stored as .br and .gz copies: the hashes must be of the text, whichever copy is sent.
    for (const encoding of ['br', 'gzip', 'identity']) {
      const page = encoding === 'identity' ? shell : await fetchRaw('/', { headers: { 'accept-encoding': encoding } })
      expect(page.status, encoding).toBe(200)
      expect(page.type).toMatch(/text\/html/)
      expectSecurityHeaders(page)
      const inline = [...page.body.matchAll(/<script([^>]*)>([\s\S]*?)<\/script>/g)]
        .filter(([, attrs, body]) => !/src=|application\/json/.test(attrs!) && body)
      expect(inline.length).toBeGreaterThan(0)
      const scriptSrc = directives(page.headers.get('content-security-policy')).get('script-src')!
      for (const [, , body] of inline) {
        // Source: CSP Level 3, section 8.4 "Does a source list allow all inline behavior": sha256 of the script text, base64.
        expect(scriptSrc, encoding).toContain(`'sha256-${createHash('sha256').update(body!).digest('base64')}'`)
      }
    }
  })

  it('a revalidated shell (304) sends no policy, so the browser keeps the one with the hashes of the copy it holds', async () => {
    // Source: RFC 9111 section 4.3.4 (freshening stored responses): the stored response's header
    // fields are replaced by those the 304 carries, and kept where the 304 has none.
    const first = await fetchRaw('/', { headers: { 'accept-encoding': 'br' } })
    const etag = first.headers.get('etag')
    expect(etag).toBeTruthy()
    const again = await fetchRaw('/', { headers: { 'accept-encoding': 'br', 'if-none-match': etag! } })
    expect(again.status).toBe(304)
    expect(again.headers.get('content-security-policy')).toBeNull()
    expect(again.headers.get('x-frame-options')).toBe('DENY')
  })

  it('pages rendered on request (a deep link, the pay page, an unknown page)', async () => {
    for (const path of ['/jobs', '/pay/not-a-real-token-0123456789', '/no-such-page']) {
      const r = await fetchRaw(path)
      expect(r.type, path).toMatch(/text\/html/)
      expectSecurityHeaders(r)
      const scriptSrc = directives(r.headers.get('content-security-policy')).get('script-src')!
      for (const [, attrs, body] of r.body.matchAll(/<script([^>]*)>([\s\S]*?)<\/script>/g)) {
        if (/src=|application\/json/.test(attrs!) || !body) continue
        expect(scriptSrc, path).toContain(`'sha256-${createHash('sha256').update(body).digest('base64')}'`)
      }
    }
  })

  it('built scripts, styles and fonts, the service worker, the manifest and icons', async () => {
    const script = shell.body.match(/<script type="module" src="([^"]+)"/)![1]!
    const style = shell.body.match(/<link rel="stylesheet" href="([^"]+)"/)![1]!
    const css = await fetchRaw(style)
    const font = css.body.match(/url\(([^)]+\.woff2)\)/)?.[1]
    expect(font, 'a bundled font').toBeTruthy()
    const fontPath = new URL(font!, BASE + style).pathname
    expect(fontPath).toMatch(/^\/_nuxt\//)
    const assets = [await fetchRaw(script), css, await fetchRaw(fontPath), await fetchRaw('/sw.js'), await fetchRaw('/manifest.webmanifest'), await fetchRaw('/favicon.svg')]
    for (const r of assets) {
      expect(r.status, r.path).toBe(200)
      expectSecurityHeaders(r)
    }
    expect((await fetchRaw('/sw.js')).type).toMatch(/javascript/)
  })

  it('API answers: JSON, 401, 400, 404 and a missing built file', async () => {
    const answers = [
      await fetchRaw('/api/health'),
      await fetchRaw('/api/auth/me'),
      await fetchRaw('/api/auth/login', { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{not json' }),
      await fetchRaw('/api/no-such-route'),
      await fetchRaw('/_nuxt/no-such-file.js'),
    ]
    expect(answers.map(a => a.status)).toEqual([200, 401, 400, 404, 404])
    for (const r of answers) expectSecurityHeaders(r)
    const me = await tech.get('/api/auth/me')
    expect(me.headers.get('content-security-policy')).toContain(`frame-ancestors 'none'`)
    expect(me.headers.get('x-content-type-options')).toBe('nosniff')
  })
})
