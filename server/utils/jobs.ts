import { and, eq, isNull } from 'drizzle-orm'
import { formatMoney } from '#shared/utils/jobs/money'

/** What the shop says about itself on records and e-mails, its billing rules, and which e-mails go out. */
export interface ShopSettings {
  name: string
  address: string
  phone: string
  email: string
  labourRateCents: number
  taxRateBasisPoints: number
  currency: string
  readyEmail: boolean
  invoiceEmail: boolean
  paymentEmail: boolean
}

/** The switches are the shop's own business: a player's copy leaves them out. */
export const INTERNAL_SETTINGS = ['readyEmail', 'invoiceEmail', 'paymentEmail'] as const

export const SETTINGS_DEFAULTS: Omit<ShopSettings, 'name'> = {
  address: '',
  phone: '',
  email: '',
  labourRateCents: 9000,
  taxRateBasisPoints: 0,
  currency: 'usd',
  readyEmail: true,
  invoiceEmail: true,
  paymentEmail: true,
}

export async function shopSettingsOf(db: Db | Tx, shopId: string): Promise<ShopSettings> {
  const [row] = await db.select({ name: tables.shops.name, s: tables.shopSettings }).from(tables.shops)
    .leftJoin(tables.shopSettings, eq(tables.shopSettings.shopId, tables.shops.id))
    .where(eq(tables.shops.id, shopId))
  const s = row?.s
  const name = row?.name ?? ''
  if (!s) return { name, ...SETTINGS_DEFAULTS }
  return {
    name, address: s.address, phone: s.phone, email: s.email,
    labourRateCents: s.labourRateCents, taxRateBasisPoints: s.taxRateBasisPoints, currency: s.currency,
    readyEmail: s.readyEmail, invoiceEmail: s.invoiceEmail, paymentEmail: s.paymentEmail,
  }
}

/** A live job of this shop, or 404 (missing, deleted and other shops' look the same). */
export async function findShopJob(db: Db | Tx, shopId: string, id: string) {
  const [row] = await db.select().from(tables.jobs)
    .where(and(eq(tables.jobs.id, id), eq(tables.jobs.shopId, shopId), isNull(tables.jobs.deletedAt))).limit(1)
  if (!row) throw createError({ statusCode: 404, message: 'Job not found.' })
  return row
}

/** Is this user the player linked to the job's customer? */
export async function isJobOfPlayer(db: Db | Tx, shopId: string, jobId: string, userId: string) {
  const [row] = await db.select({ id: tables.jobs.id }).from(tables.jobs)
    .innerJoin(tables.customers, eq(tables.customers.id, tables.jobs.customerId))
    .where(and(eq(tables.jobs.id, jobId), eq(tables.jobs.shopId, shopId), isNull(tables.jobs.deletedAt), eq(tables.customers.playerUserId, userId)))
    .limit(1)
  return !!row
}

async function jobMailFacts(shopId: string, jobId: string) {
  const db = useDb()
  const [row] = await db.select({ email: tables.customers.email, name: tables.customers.name, amp: tables.amps.description })
    .from(tables.jobs)
    .innerJoin(tables.customers, eq(tables.customers.id, tables.jobs.customerId))
    .leftJoin(tables.amps, eq(tables.amps.id, tables.jobs.ampId))
    .where(and(eq(tables.jobs.id, jobId), eq(tables.jobs.shopId, shopId)))
  if (!row) return undefined
  const settings = await shopSettingsOf(db, shopId)
  return { ...row, shop: settings.name, settings }
}

/** The shop's name, address and contact under every message, as the owner set them. */
function signature(s: ShopSettings) {
  const contact = [s.phone, s.email].filter(Boolean).join(' · ')
  return `\n\n--\n${[s.name, s.address, contact].filter(Boolean).join('\n')}`
}

const jobLink = (jobId: string) => `${useRuntimeConfig().publicOrigin}/jobs/${jobId}`

/** "Your amp is ready": only when the shop has it switched on and the customer has an address. */
export async function sendReadyMail(shopId: string, jobId: string) {
  const f = await jobMailFacts(shopId, jobId)
  if (!f?.email || !f.settings.readyEmail) return false
  return sendMail({
    shopId,
    replyTo: f.settings.email || undefined,
    to: f.email,
    subject: `Your amp is ready to collect from ${f.shop}`,
    text: `Hello ${f.name},\n\nYour ${f.amp ?? 'amp'} is finished on the bench and ready to collect from ${f.shop}.\n\n`
      + `The job, with what was measured and done, is here:\n${jobLink(jobId)}\n\nThank you.${signature(f.settings)}`,
  })
}

/**
 * The estimate or invoice to the customer. An invoice carries its pay link, which opens and pays
 * it with no account; without one (an estimate) the link goes to the job.
 */
export async function sendInvoiceMail(shopId: string, invoice: { jobId: string, kind: 'estimate' | 'invoice', number: number, totalCents: number, currency: string }, payToken?: string) {
  const f = await jobMailFacts(shopId, invoice.jobId)
  if (!f?.email || !f.settings.invoiceEmail) return false
  const what = invoice.kind === 'estimate' ? 'estimate' : 'invoice'
  const total = formatMoney(invoice.totalCents, invoice.currency.toUpperCase())
  const link = payToken
    ? `See the lines and pay here (no account needed; the link works for ${PAY_LINK_DAYS} days):\n${payUrl(payToken)}`
    : `See the lines here:\n${jobLink(invoice.jobId)}`
  return sendMail({
    shopId,
    replyTo: f.settings.email || undefined,
    to: f.email,
    subject: `Your ${what} no. ${invoice.number} from ${f.shop}`,
    text: `Hello ${f.name},\n\n${f.shop} has sent you ${what} no. ${invoice.number} for your ${f.amp ?? 'amp'}.\n`
      + `Total: ${total}\n\n${link}\n\nThank you.${signature(f.settings)}`,
  })
}

export async function sendPaymentMail(shopId: string, invoice: { jobId: string, number: number, totalCents: number, currency: string }) {
  const f = await jobMailFacts(shopId, invoice.jobId)
  if (!f?.email || !f.settings.paymentEmail) return false
  const total = formatMoney(invoice.totalCents, invoice.currency.toUpperCase())
  return sendMail({
    shopId,
    replyTo: f.settings.email || undefined,
    to: f.email,
    subject: `Payment received for invoice no. ${invoice.number}`,
    text: `Hello ${f.name},\n\n${f.shop} has received your payment of ${total} for invoice no. ${invoice.number}.\n\n`
      + `The job is here:\n${jobLink(invoice.jobId)}\n\nThank you.${signature(f.settings)}`,
  })
}
