import { createHash } from 'node:crypto'

/** The content-security-policy, without the hashes of a page's own inline scripts. */
const POLICY: Record<string, string[]> = {
  'default-src': [`'self'`],
  'script-src': [`'self'`],
  'style-src': [`'self'`],
  'img-src': [`'self'`, 'data:', 'blob:'],
  'font-src': [`'self'`],
  'connect-src': [`'self'`],
  'worker-src': [`'self'`],
  'manifest-src': [`'self'`],
  'object-src': [`'none'`],
  'base-uri': [`'self'`],
  'form-action': [`'self'`],
  'frame-ancestors': [`'none'`],
}

export function contentSecurityPolicy(scriptHashes: string[] = []) {
  return Object.entries(POLICY)
    .map(([name, values]) => [name, ...values, ...(name === 'script-src' ? scriptHashes.map(h => `'sha256-${h}'`) : [])].join(' '))
    .join('; ')
}

export const SECURITY_HEADERS = {
  'content-security-policy': contentSecurityPolicy(),
  'x-content-type-options': 'nosniff',
  // A pay or invitation link carries its token in the path: never pass it on in Referer.
  'referrer-policy': 'no-referrer',
  'x-frame-options': 'DENY',
} as const

// Executable inline scripts: no src, and not a data block (JSON), which CSP does not govern.
const INLINE_SCRIPT = /<script\b([^>]*)>([\s\S]*?)<\/script>/gi
const DATA_TYPE = /\btype\s*=\s*["']?(?:application\/(?:ld\+)?json|importmap)/i

/** sha256 (base64) of each inline script the page runs, for `script-src`. */
export function inlineScriptHashes(html: string): string[] {
  const hashes = new Set<string>()
  for (const [, attrs = '', body = ''] of html.matchAll(INLINE_SCRIPT)) {
    if (/\bsrc\s*=/i.test(attrs) || DATA_TYPE.test(attrs) || !body) continue
    hashes.add(createHash('sha256').update(body, 'utf8').digest('base64'))
  }
  return [...hashes]
}
