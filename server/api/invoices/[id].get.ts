import { asc, eq } from 'drizzle-orm'
import { idParams } from '#shared/utils/schemas/records'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event)
  const { id } = await validParams(event, idParams)
  const invoice = await visibleInvoice(access, id)
  const payments = await useDb().select({ id: tables.payments.id, amountCents: tables.payments.amountCents, status: tables.payments.status, createdAt: tables.payments.createdAt })
    .from(tables.payments).where(eq(tables.payments.invoiceId, invoice.id)).orderBy(asc(tables.payments.createdAt))
  return { ...invoice, payments }
})
