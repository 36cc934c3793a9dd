// Security headers on every response: the shell, built assets, the service worker, API JSON and
// errors. Set on request, before any handler (static files included) can answer; an HTML page
// then gets the hashes of its own inline scripts (the shell's config script changes per build).
import { brotliDecompressSync, gunzipSync } from 'node:zlib'

/** The page's text: a built page may be served as its pre-compressed .br or .gz copy. */
function htmlOf(body: unknown, encoding: string): string | null {
  if (typeof body === 'string') return body
  if (!Buffer.isBuffer(body) && !(body instanceof Uint8Array)) return null
  const buf = Buffer.from(body)
  if (encoding === 'br') return brotliDecompressSync(buf).toString('utf8')
  if (encoding === 'gzip') return gunzipSync(buf).toString('utf8')
  return buf.toString('utf8')
}

export default defineNitroPlugin((nitro) => {
  nitro.hooks.hook('request', (event) => {
    setResponseHeaders(event, SECURITY_HEADERS)
  })
  nitro.hooks.hook('beforeResponse', (event, response) => {
    // A 304 has no body to hash, and the browser lays the 304's headers over the copy it keeps:
    // a policy without the page's hashes would then block the very page it revalidated.
    if (getResponseStatus(event) === 304) {
      removeResponseHeader(event, 'content-security-policy')
      return
    }
    const type = String(getResponseHeader(event, 'content-type') ?? '')
    if (!type.includes('text/html')) return
    const html = htmlOf(response.body, String(getResponseHeader(event, 'content-encoding') ?? ''))
    if (html === null) return
    setResponseHeader(event, 'content-security-policy', contentSecurityPolicy(inlineScriptHashes(html)))
  })
})
