import { readdirSync, readFileSync, existsSync } from 'node:fs'
import { join } from 'node:path'

const DIR = process.env.TW_TEST_MAIL_DIR ?? '.data/mail'

export interface CaughtMail { to: string[], raw: string, receivedAt: string }

/** Mail caught by the local SMTP fake, newest last. */
export function caughtMail(): CaughtMail[] {
  if (!existsSync(DIR)) return []
  return readdirSync(DIR).sort().map(f => JSON.parse(readFileSync(join(DIR, f), 'utf8')) as CaughtMail)
}

export async function waitForMail(to: string, timeoutMs = 5000): Promise<CaughtMail> {
  const deadline = Date.now() + timeoutMs
  for (;;) {
    const hit = caughtMail().filter(m => m.to.includes(to)).at(-1)
    if (hit) return hit
    if (Date.now() > deadline) throw new Error(`no mail to ${to}`)
    await new Promise(r => setTimeout(r, 100))
  }
}
