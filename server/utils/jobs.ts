import { and, eq, isNull } from 'drizzle-orm'
import { formatMoney } from '#shared/utils/jobs/money'

export interface ShopSettings {
  labourRateCents: number
  taxRateBasisPoints: number
  currency: string
  readyEmail: boolean
}

export const SETTINGS_DEFAULTS: ShopSettings = {
  labourRateCents: 9000,
  taxRateBasisPoints: 0,
  currency: 'usd',
  readyEmail: true,
}

export async function shopSettingsOf(db: Db | Tx, shopId: string): Promise<ShopSettings> {
  const [row] = await db.select().from(tables.shopSettings).where(eq(tables.shopSettings.shopId, shopId))
  if (!row) return { ...SETTINGS_DEFAULTS }
  return { labourRateCents: row.labourRateCents, taxRateBasisPoints: row.taxRateBasisPoints, currency: row.currency, readyEmail: row.readyEmail }
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
  const [row] = await db.select({ email: tables.customers.email, name: tables.customers.name, amp: tables.amps.description, shop: tables.shops.name })
    .from(tables.jobs)
    .innerJoin(tables.customers, eq(tables.customers.id, tables.jobs.customerId))
    .leftJoin(tables.amps, eq(tables.amps.id, tables.jobs.ampId))
    .innerJoin(tables.shops, eq(tables.shops.id, tables.jobs.shopId))
    .where(and(eq(tables.jobs.id, jobId), eq(tables.jobs.shopId, shopId)))
  return row
}

const jobLink = (jobId: string) => `${useRuntimeConfig().publicOrigin}/jobs/${jobId}`

/** "Your amp is ready": only when the shop has it switched on and the customer has an address. */
export async function sendReadyMail(shopId: string, jobId: string) {
  const settings = await shopSettingsOf(useDb(), shopId)
  if (!settings.readyEmail) return false
  const f = await jobMailFacts(shopId, jobId)
  if (!f?.email) return false
  return sendMail({
    shopId,
    to: f.email,
    subject: `Your amp is ready to collect from ${f.shop}`,
    text: `Hello ${f.name},\n\nYour ${f.amp ?? 'amp'} is finished on the bench and ready to collect from ${f.shop}.\n\n`
      + `The job, with what was measured and done, is here:\n${jobLink(jobId)}\n\nThank you.`,
  })
}

export async function sendInvoiceMail(shopId: string, invoice: { jobId: string, kind: 'estimate' | 'invoice', number: number, totalCents: number, currency: string }) {
  const f = await jobMailFacts(shopId, invoice.jobId)
  if (!f?.email) return false
  const what = invoice.kind === 'estimate' ? 'estimate' : 'invoice'
  const total = formatMoney(invoice.totalCents, invoice.currency.toUpperCase())
  return sendMail({
    shopId,
    to: f.email,
    subject: `Your ${what} no. ${invoice.number} from ${f.shop}`,
    text: `Hello ${f.name},\n\n${f.shop} has sent you ${what} no. ${invoice.number} for your ${f.amp ?? 'amp'}.\n`
      + `Total: ${total}\n\nSee the lines${invoice.kind === 'invoice' ? ' and pay' : ''} here:\n${jobLink(invoice.jobId)}\n\nThank you.`,
  })
}

export async function sendPaymentMail(shopId: string, invoice: { jobId: string, number: number, totalCents: number, currency: string }) {
  const f = await jobMailFacts(shopId, invoice.jobId)
  if (!f?.email) return false
  const total = formatMoney(invoice.totalCents, invoice.currency.toUpperCase())
  return sendMail({
    shopId,
    to: f.email,
    subject: `Payment received for invoice no. ${invoice.number}`,
    text: `Hello ${f.name},\n\n${f.shop} has received your payment of ${total} for invoice no. ${invoice.number}.\n\n`
      + `The job is here:\n${jobLink(invoice.jobId)}\n\nThank you.`,
  })
}
