import { describe, expect, it } from 'vitest'
import { contentSecurityPolicy, inlineScriptHashes } from '../../server/utils/security-headers'
import { cookieSecure } from '../../server/utils/cookie-flags'

describe('inlineScriptHashes', () => {
  it('hashes an inline script the way CSP expects', () => {
    // Source: the CSP Level 3 / MDN script-src hash example, recalled from memory:
    // alert('Hello, world.'); -> 'sha256-qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng='.
    expect(inlineScriptHashes(`<p>x</p><script>alert('Hello, world.');</script>`)).toEqual(['qznLcsROx4GACP2dm0UCKCzCG+HiZ1guq6ZZDob/Tng='])
  })

  it('skips scripts with src, JSON data blocks and empty scripts, and lists a repeated script once', () => {
    const html = `<script type="module" src="/_nuxt/a.js"></script><script type="application/json" id="d">{"a":1}</script>`
      + `<script></script><script>alert('Hello, world.');</script><script>alert('Hello, world.');</script>`
    expect(inlineScriptHashes(html)).toHaveLength(1)
    expect(inlineScriptHashes(`<script src=x.js></script>`)).toEqual([])
  })
})

describe('contentSecurityPolicy', () => {
  const directives = (csp: string) => new Map(csp.split('; ').map((d) => {
    const [name, ...values] = d.split(' ')
    return [name, values]
  }))

  it('allows only this origin, no inline or eval scripts, and no framing', () => {
    const d = directives(contentSecurityPolicy())
    expect(d.get('default-src')).toEqual([`'self'`])
    expect(d.get('script-src')).toEqual([`'self'`])
    expect(d.get('frame-ancestors')).toEqual([`'none'`])
    expect(d.get('worker-src')).toEqual([`'self'`])
    expect(d.get('object-src')).toEqual([`'none'`])
    expect(d.get('img-src')).toEqual([`'self'`, 'data:', 'blob:'])
  })

  it('adds a page\'s script hashes to script-src only', () => {
    const d = directives(contentSecurityPolicy(['abc=', 'def=']))
    expect(d.get('script-src')).toEqual([`'self'`, `'sha256-abc='`, `'sha256-def='`])
    expect(d.get('style-src')).not.toContain(`'sha256-abc='`)
  })
})

describe('cookieSecure', () => {
  it('follows the public origin when not set', () => {
    expect(cookieSecure('https://shop.example', '')).toBe(true)
    expect(cookieSecure('http://localhost:3000', '')).toBe(false)
    expect(cookieSecure('http://127.0.0.1:4123', undefined)).toBe(false)
  })

  it('obeys an explicit setting, as a boolean or as text from the environment', () => {
    expect(cookieSecure('http://localhost:3000', true)).toBe(true)
    expect(cookieSecure('http://localhost:3000', 'true')).toBe(true)
    expect(cookieSecure('https://shop.example', false)).toBe(false)
    expect(cookieSecure('https://shop.example', '0')).toBe(false)
  })

  it('keeps the flag when the origin cannot be read', () => {
    expect(cookieSecure('', '')).toBe(true)
    expect(cookieSecure('not a url', '')).toBe(true)
  })
})
