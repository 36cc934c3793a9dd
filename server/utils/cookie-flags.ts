/**
 * Whether the session cookie carries `Secure`. `setting` is NUXT_COOKIE_SECURE: true / false force
 * it; left empty it follows the public origin, so https deployments get it and a plain-http
 * loopback stack (tests, a first local run) still signs in.
 */
export function cookieSecure(publicOrigin: string, setting: unknown): boolean {
  if (setting === true || setting === 'true' || setting === '1') return true
  if (setting === false || setting === 'false' || setting === '0') return false
  try {
    return new URL(publicOrigin).protocol === 'https:'
  }
  catch {
    // An origin we cannot read: keep the safe flag.
    return true
  }
}
