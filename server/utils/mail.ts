import { randomUUID } from 'node:crypto'
import { and, asc, eq, isNotNull, isNull, lt, lte, or, sql } from 'drizzle-orm'
import nodemailer from 'nodemailer'
import type { Transporter } from 'nodemailer'

let transport: Transporter | undefined

function useTransport() {
  if (!transport) {
    const config = useRuntimeConfig()
    transport = nodemailer.createTransport({
      host: config.smtpHost,
      port: Number(config.smtpPort),
      secure: false,
      ignoreTLS: true,
      connectionTimeout: 5000,
      greetingTimeout: 5000,
      socketTimeout: 10_000,
    })
  }
  return transport
}

/** A message is given up after this many tries (about four hours of waits). */
export const MAIL_MAX_ATTEMPTS = 8
/** How long one sender holds a message while it talks to the mail server. */
const CLAIM_MS = 60_000
/** The wait after `attempts` failed tries: 30 s, then doubling, at most an hour (common practice, no source). */
export const mailRetryDelayMs = (attempts: number) => Math.min(30_000 * 2 ** Math.max(0, attempts - 1), 3_600_000)

type MailMessage = { to: string, subject: string, text: string, replyTo?: string, shopId?: string | null }

/**
 * Records the message in sent_mail (the owner's Outbox and the durable queue) and tries it once.
 * A message the mail server refused stays queued and is sent later by `retryDueMail` (the
 * `mail:retry` task, and at once after any later message goes through), exactly once.
 */
export async function sendMail(message: MailMessage) {
  const { shopId = null, ...mail } = message
  const id = randomUUID()
  try {
    await useDb().insert(tables.sentMail).values({
      id, shopId, toAddress: mail.to, subject: mail.subject.slice(0, 300), body: mail.text, replyTo: mail.replyTo ?? null,
      delivered: false, attempts: 0, nextAttemptAt: new Date(),
    })
  }
  catch (error) {
    // No database to keep it in: one try, as a courtesy (the caller still answers with its link).
    console.error('mail not recorded:', (error as Error).message)
    return deliver(mail).then(() => true, (e: Error) => {
      console.error('mail not sent:', e.message)
      return false
    })
  }
  const delivered = (await attempt(id)) === 'sent'
  // The mail server answers again: whatever waited for it goes now, not at its next slot.
  if (delivered) retryDueMail({ ignoreWait: true }).catch(error => console.error('mail retry failed:', (error as Error).message))
  return delivered
}

function deliver(mail: { to: string, subject: string, text: string, replyTo?: string | null }) {
  const { replyTo, ...rest } = mail
  return useTransport().sendMail({ from: useRuntimeConfig().mailFrom, ...rest, ...(replyTo ? { replyTo } : {}) })
}

/** Claims one queued message (no other sender holds it), tries it once and records how it went. */
async function attempt(id: string): Promise<'sent' | 'failed' | 'busy'> {
  const db = useDb()
  const m = tables.sentMail
  const now = new Date()
  const [claim] = await db.update(m).set({ claimedUntil: new Date(now.getTime() + CLAIM_MS), attempts: sql`${m.attempts} + 1` })
    .where(and(eq(m.id, id), eq(m.delivered, false), isNotNull(m.nextAttemptAt), or(isNull(m.claimedUntil), lt(m.claimedUntil, now))))
  if (claim.affectedRows !== 1) return 'busy'
  const [row] = await db.select().from(m).where(eq(m.id, id))
  if (!row) return 'busy'
  try {
    await deliver({ to: row.toAddress, subject: row.subject, text: row.body, replyTo: row.replyTo })
  }
  catch (error) {
    console.error('mail not sent:', (error as Error).message)
    const next = row.attempts >= MAIL_MAX_ATTEMPTS ? null : new Date(Date.now() + mailRetryDelayMs(row.attempts))
    await db.update(m).set({ claimedUntil: null, nextAttemptAt: next }).where(eq(m.id, id))
    return 'failed'
  }
  await db.update(m).set({ delivered: true, nextAttemptAt: null, claimedUntil: null }).where(eq(m.id, id))
  return 'sent'
}

let retrying: Promise<{ tried: number, sent: number }> | null = null

/** Tries every queued message that is due (or all of them, `ignoreWait`), oldest first; stops at the first refusal. */
export function retryDueMail(opts: { ignoreWait?: boolean } = {}) {
  retrying ??= (async () => {
    const m = tables.sentMail
    const due = await useDb().select({ id: m.id }).from(m)
      .where(and(eq(m.delivered, false), opts.ignoreWait ? isNotNull(m.nextAttemptAt) : lte(m.nextAttemptAt, new Date())))
      .orderBy(asc(m.createdAt)).limit(100)
    let sent = 0
    let tried = 0
    for (const { id } of due) {
      const outcome = await attempt(id)
      if (outcome === 'busy') continue
      tried++
      if (outcome === 'failed') break
      sent++
    }
    return { tried, sent }
  })().finally(() => {
    retrying = null
  })
  return retrying
}
