import { randomUUID } from 'node:crypto'
import { and, eq, inArray } from 'drizzle-orm'
import type { ShopAccess } from './authz'

const refuse = (why: string) => createError({ statusCode: 409, message: why })
const notPayable = (state: string) => refuse(state === 'paid' ? 'This invoice is already paid.' : state === 'void' ? 'This invoice was withdrawn by the shop.' : 'Only a sent invoice can be paid.')

async function refuseOpenPayment(tx: Tx, invoiceId: string) {
  // One payment at a time: a second tap, or cash at the counter while a card payment is under way, must not charge twice.
  const [open] = await tx.select({ id: tables.payments.id }).from(tables.payments)
    .where(and(eq(tables.payments.invoiceId, invoiceId), inArray(tables.payments.status, ['pending', 'succeeded'])))
  if (open) throw refuse('A payment for this invoice is already under way.')
}

export async function hasPendingPayment(invoiceId: string) {
  const [row] = await useDb().select({ id: tables.payments.id }).from(tables.payments)
    .where(and(eq(tables.payments.invoiceId, invoiceId), eq(tables.payments.status, 'pending'))).limit(1)
  return !!row
}

const providerDown = (what: string) => createError({ statusCode: 503, message: `The payment service is not answering; ${what} Try again in a moment.` })

/**
 * A payment started earlier whose confirm never got an answer (the provider went away) stays
 * pending. Paying again picks it up: confirmed now if the provider never saw the confirm, left to
 * its webhook if it did. So a retry after an outage charges once and records one payment row.
 */
async function resumePending(invoiceId: string) {
  const [pending] = await useDb().select().from(tables.payments)
    .where(and(eq(tables.payments.invoiceId, invoiceId), eq(tables.payments.status, 'pending'), eq(tables.payments.method, 'online'))).limit(1)
  if (!pending?.providerIntentId) return null
  const payments = usePayments()
  const intent = await payments.paymentIntents.retrieve(pending.providerIntentId).catch((error: { statusCode?: number }) => {
    if (error.statusCode === 404) return null
    throw providerDown('your earlier payment is still waiting and nothing more was charged.')
  })
  if (!intent) {
    // The provider has no such payment, so it took nothing: start afresh.
    await useDb().update(tables.payments).set({ status: 'failed' }).where(eq(tables.payments.id, pending.id))
    return null
  }
  if (intent.status === 'requires_confirmation' || intent.status === 'requires_payment_method') {
    await payments.paymentIntents.confirm(intent.id, { payment_method: TEST_PAYMENT_METHOD }).catch(() => {
      throw providerDown('your earlier payment is still waiting and nothing more was charged.')
    })
  }
  return { paymentId: pending.id, status: 'pending' as const }
}

/**
 * Pays a sent invoice through the payment provider (signed in, or through its pay link with
 * `userId` null). Answers pending: the invoice is marked paid only when the provider's webhook says so.
 */
export async function startOnlinePayment(shopId: string, invoiceId: string, userId: string | null) {
  const invoice = await findInvoice(useDb(), shopId, invoiceId)
  if (invoice.kind !== 'invoice') throw createError({ statusCode: 400, message: 'An estimate cannot be paid; send an invoice.' })
  if (invoice.state !== 'sent') throw notPayable(invoice.state)
  const resumed = await resumePending(invoiceId)
  if (resumed) return resumed

  const payments = usePayments()
  const intent = await payments.paymentIntents.create({
    amount: invoice.totalCents,
    currency: invoice.currency,
    metadata: { invoiceId: invoice.id, shopId },
  }).catch(() => {
    throw providerDown('nothing was charged.')
  })

  const paymentId = randomUUID()
  await withRetry(() => useDb().transaction(async (tx) => {
    const current = await findInvoice(tx, shopId, invoiceId, { lock: true })
    if (current.state !== 'sent') throw notPayable(current.state)
    await refuseOpenPayment(tx, invoiceId)
    await tx.insert(tables.payments).values({ id: paymentId, shopId, invoiceId, providerIntentId: intent.id, method: 'online', amountCents: intent.amount, status: 'pending' })
    await audit(tx, { shopId, userId, action: 'payment.start', detail: { invoiceId, paymentId, viaLink: userId === null } })
  }))

  try {
    await payments.paymentIntents.confirm(intent.id, { payment_method: TEST_PAYMENT_METHOD })
  }
  catch (error) {
    // No answer at all: the provider may have taken it, so the payment stays pending for a retry to settle.
    if ((error as { type?: string }).type === 'StripeConnectionError') throw providerDown('the payment is kept and nothing more will be charged.')
    await useDb().update(tables.payments).set({ status: 'failed' }).where(eq(tables.payments.id, paymentId))
    throw createError({ statusCode: 502, message: 'The payment could not be confirmed. Try again.' })
  }
  return { paymentId, status: 'pending' as const }
}

/**
 * Money taken at the counter (cash, or card on the shop's own terminal): recorded by the desk or
 * owner and paid at once. The amount must be the invoice's total, so a changed invoice is not paid blind.
 */
export async function takeCounterPayment(access: ShopAccess, invoiceId: string, pay: { method: 'cash' | 'card', amountCents: number }) {
  let paid: typeof tables.invoices.$inferSelect | undefined
  await withRetry(() => useDb().transaction(async (tx) => {
    const version = await nextShopVersion(tx, access.shopId)
    const invoice = await findInvoice(tx, access.shopId, invoiceId, { lock: true })
    if (invoice.kind !== 'invoice') throw createError({ statusCode: 400, message: 'An estimate cannot be paid; make an invoice.' })
    if (invoice.state !== 'sent' && invoice.state !== 'draft') throw notPayable(invoice.state)
    if (pay.amountCents !== invoice.totalCents) throw refuse('The amount is not the invoice\'s total; reload the invoice and try again.')
    await refuseOpenPayment(tx, invoiceId)
    const paymentId = randomUUID()
    const now = new Date()
    await tx.insert(tables.payments).values({ id: paymentId, shopId: access.shopId, invoiceId, method: pay.method, amountCents: invoice.totalCents, status: 'succeeded', recordedBy: access.userId })
    await tx.update(tables.invoices).set({ state: 'paid', paidAt: now, paidWith: pay.method, issuedAt: invoice.issuedAt ?? now, version })
      .where(and(eq(tables.invoices.id, invoiceId), eq(tables.invoices.shopId, access.shopId)))
    await audit(tx, { shopId: access.shopId, userId: access.userId, action: 'invoice.paid', detail: { invoiceId, paymentId, method: pay.method } })
    paid = invoice
  }))
  const invoice = paid!
  runAfterCommit([() => sendPaymentMail(access.shopId, invoice)])
  return findInvoice(useDb(), access.shopId, invoiceId)
}
