import { randomUUID } from 'node:crypto'
import { and, eq, inArray } from 'drizzle-orm'
import { idParams } from '#shared/utils/schemas/records'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('invoices', 'pay'))
  const { id } = await validParams(event, idParams)
  const invoice = await visibleInvoice(access, id)
  const refuse = (why: string) => createError({ statusCode: 409, message: why })
  if (invoice.kind !== 'invoice') throw createError({ statusCode: 400, message: 'An estimate cannot be paid; send an invoice.' })
  if (invoice.state === 'paid') throw refuse('This invoice is already paid.')
  if (invoice.state !== 'sent') throw refuse('Only a sent invoice can be paid.')

  const payments = usePayments()
  const intent = await payments.paymentIntents.create({
    amount: invoice.totalCents,
    currency: invoice.currency,
    metadata: { invoiceId: invoice.id, shopId: access.shopId },
  }).catch(() => {
    throw createError({ statusCode: 502, message: 'The payment provider did not answer. Try again.' })
  })

  const paymentId = randomUUID()
  await withRetry(() => useDb().transaction(async (tx) => {
    const current = await findInvoice(tx, access.shopId, id, { lock: true })
    if (current.state !== 'sent') throw refuse(current.state === 'paid' ? 'This invoice is already paid.' : 'Only a sent invoice can be paid.')
    // One payment at a time: a second tap must not charge twice.
    const [open] = await tx.select({ id: tables.payments.id }).from(tables.payments)
      .where(and(eq(tables.payments.invoiceId, id), inArray(tables.payments.status, ['pending', 'succeeded'])))
    if (open) throw refuse('A payment for this invoice is already under way.')
    await tx.insert(tables.payments).values({ id: paymentId, shopId: access.shopId, invoiceId: id, providerIntentId: intent.id, amountCents: intent.amount, status: 'pending' })
    await audit(tx, { shopId: access.shopId, userId: access.userId, action: 'payment.start', detail: { invoiceId: id, paymentId } })
  }))

  try {
    await payments.paymentIntents.confirm(intent.id, { payment_method: TEST_PAYMENT_METHOD })
  }
  catch {
    await useDb().update(tables.payments).set({ status: 'failed' }).where(eq(tables.payments.id, paymentId))
    throw createError({ statusCode: 502, message: 'The payment could not be confirmed. Try again.' })
  }
  // The invoice is marked paid only when the provider's webhook says so.
  setResponseStatus(event, 202)
  return { paymentId, status: 'pending' as const }
})
