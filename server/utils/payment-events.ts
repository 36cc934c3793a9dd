import { and, eq } from 'drizzle-orm'
import type Stripe from 'stripe'

/**
 * One verified provider event, handled once: the event id is recorded in the same transaction
 * as its effect, so a replay (or a second delivery racing the first) changes nothing.
 */
export async function handlePaymentEvent(event: Stripe.Event): Promise<'handled' | 'duplicate' | 'ignored'> {
  const db = useDb()
  const intent = event.type === 'payment_intent.succeeded' ? event.data.object : null
  const [payment] = intent
    ? await db.select().from(tables.payments).where(eq(tables.payments.providerIntentId, intent.id))
    : []
  let paid: typeof tables.invoices.$inferSelect | undefined
  const outcome = await withRetry(() => db.transaction(async (tx) => {
    paid = undefined
    const fresh = await tx.insert(tables.webhookEvents).ignore().values({ id: event.id, type: event.type.slice(0, 100) })
    if (fresh[0].affectedRows === 0) return 'duplicate' as const
    if (!intent || !payment) return 'ignored' as const
    // Same lock order as every other writer: the shop's version row first.
    const version = await nextShopVersion(tx, payment.shopId)
    const [current] = await tx.select().from(tables.payments).where(eq(tables.payments.id, payment.id)).for('update')
    if (!current || current.status === 'succeeded' || intent.amount !== current.amountCents) return 'ignored' as const
    await tx.update(tables.payments).set({ status: 'succeeded' }).where(eq(tables.payments.id, payment.id))
    const invoice = await findInvoice(tx, payment.shopId, payment.invoiceId, { lock: true })
    if (invoice.state === 'paid') return 'handled' as const
    await tx.update(tables.invoices).set({ state: 'paid', paidAt: new Date(), paidWith: 'online', version })
      .where(and(eq(tables.invoices.id, invoice.id), eq(tables.invoices.shopId, payment.shopId)))
    await audit(tx, { shopId: payment.shopId, action: 'invoice.paid', detail: { invoiceId: invoice.id, paymentId: payment.id, eventId: event.id } })
    paid = invoice
    return 'handled' as const
  }))
  const invoice = paid
  if (invoice) runAfterCommit([() => sendPaymentMail(invoice.shopId, invoice)])
  return outcome
}
