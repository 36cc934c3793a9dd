// Reads and writes the project's .env; generates secrets on first run.
import { existsSync, readFileSync, writeFileSync } from 'node:fs'
import { randomBytes } from 'node:crypto'

export function readEnvFile(file) {
  if (!existsSync(file)) return {}
  const out = {}
  for (const line of readFileSync(file, 'utf8').split('\n')) {
    const m = line.match(/^\s*([A-Z0-9_]+)\s*=\s*(.*)\s*$/)
    if (m) out[m[1]] = m[2].replace(/^"(.*)"$/, '$1')
  }
  return out
}

const secret = bytes => randomBytes(bytes).toString('base64url')

/** Fill in missing keys (never overwrite what is there), write the file, return the values. */
export function ensureEnvFile(file, defaults) {
  const current = readEnvFile(file)
  const generated = {
    TW_DB_PASSWORD: secret(18),
    NUXT_SESSION_PASSWORD: secret(36),
    NUXT_PAYMENT_SECRET_KEY: `sk_test_local_${randomBytes(12).toString('hex')}`,
    NUXT_PAYMENT_WEBHOOK_SECRET: `whsec_${randomBytes(24).toString('hex')}`,
  }
  const merged = { ...defaults, ...generated, ...current }
  const changed = Object.keys(merged).some(k => !(k in current))
  if (changed) {
    const body = Object.entries(merged).map(([k, v]) => `${k}=${v}`).join('\n') + '\n'
    writeFileSync(file, '# Written by npm start on first run; edit freely.\n' + body, { mode: 0o600 })
  }
  return merged
}
