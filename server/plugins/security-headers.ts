// Security headers on every response: the shell, built assets, the service worker, API JSON and
// errors. Set on request, before any handler (static files included) can answer; an HTML page
// then gets the hashes of its own inline scripts (the shell's config script changes per build).
export default defineNitroPlugin((nitro) => {
  nitro.hooks.hook('request', (event) => {
    setResponseHeaders(event, SECURITY_HEADERS)
  })
  nitro.hooks.hook('beforeResponse', (event, response) => {
    const type = String(getResponseHeader(event, 'content-type') ?? '')
    if (!type.includes('text/html')) return
    const body = response.body
    const html = typeof body === 'string' ? body : Buffer.isBuffer(body) ? body.toString('utf8') : null
    if (html === null) return
    setResponseHeader(event, 'content-security-policy', contentSecurityPolicy(inlineScriptHashes(html)))
  })
})
