import { randomUUID } from 'node:crypto'
import { and, asc, eq, isNull } from 'drizzle-orm'
import { invoiceTotals, labourTotalCents, partTotalCents } from '#shared/utils/jobs/money'
import type { ShopAccess } from './authz'

type InvoiceLine = (typeof tables.invoices.$inferSelect)['lines'][number]

/** Lines from the job's current parts and labour, totals at the shop's tax rate, the next number of its kind. */
export async function createInvoice(access: ShopAccess, jobId: string, kind: 'estimate' | 'invoice') {
  const id = randomUUID()
  await useDb().transaction(async (tx) => {
    const version = await nextShopVersion(tx, access.shopId)
    await findShopJob(tx, access.shopId, jobId)
    const [parts, labour, settings] = await Promise.all([
      tx.select().from(tables.jobParts).where(and(eq(tables.jobParts.shopId, access.shopId), eq(tables.jobParts.jobId, jobId), isNull(tables.jobParts.deletedAt))).orderBy(asc(tables.jobParts.createdAt), asc(tables.jobParts.id)),
      tx.select().from(tables.jobLabour).where(and(eq(tables.jobLabour.shopId, access.shopId), eq(tables.jobLabour.jobId, jobId), isNull(tables.jobLabour.deletedAt))).orderBy(asc(tables.jobLabour.createdAt), asc(tables.jobLabour.id)),
      shopSettingsOf(tx, access.shopId),
    ])
    if (!parts.length && !labour.length) throw createError({ statusCode: 400, message: 'Add parts or labour to the job first.' })
    const lines: InvoiceLine[] = [
      ...parts.map(p => ({ kind: 'part' as const, description: p.description, quantity: p.quantity, unitCents: p.unitPriceCents, totalCents: partTotalCents(p) })),
      // Labour is billed in hours at the line's hourly rate.
      ...labour.map(l => ({ kind: 'labour' as const, description: l.description || 'Labour', quantity: l.minutes / 60, unitCents: l.rateCents, totalCents: labourTotalCents(l) })),
    ]
    const totals = invoiceTotals(parts, labour, settings.taxRateBasisPoints)
    const counterWhere = and(eq(tables.invoiceCounters.shopId, access.shopId), eq(tables.invoiceCounters.kind, kind))
    const lockCounter = () => tx.select({ last: tables.invoiceCounters.last }).from(tables.invoiceCounters).where(counterWhere).for('update')
    let [counter] = await lockCounter()
    if (!counter) {
      await tx.insert(tables.invoiceCounters).ignore().values({ shopId: access.shopId, kind, last: 0 })
      ;[counter] = await lockCounter()
    }
    const number = (counter?.last ?? 0) + 1
    await tx.update(tables.invoiceCounters).set({ last: number }).where(counterWhere)
    await tx.insert(tables.invoices).values({
      id, shopId: access.shopId, jobId, number, kind, state: 'draft', lines, ...totals,
      taxRateBasisPoints: settings.taxRateBasisPoints, currency: settings.currency, version,
    })
    await audit(tx, { shopId: access.shopId, userId: access.userId, action: 'invoice.create', detail: { invoiceId: id, jobId, kind, number } })
  })
  return findInvoice(useDb(), access.shopId, id)
}

export async function findInvoice(db: Db | Tx, shopId: string, id: string, opts: { lock?: boolean } = {}) {
  const q = db.select().from(tables.invoices).where(and(eq(tables.invoices.id, id), eq(tables.invoices.shopId, shopId)))
  const [row] = opts.lock ? await q.for('update') : await q
  if (!row) throw createError({ statusCode: 404, message: 'Invoice not found.' })
  return row
}

/** Staff see the shop's invoices; a player only the sent ones of jobs of their linked customer. */
export async function visibleInvoice(access: ShopAccess, id: string) {
  const db = useDb()
  const invoice = await findInvoice(db, access.shopId, id)
  if (access.role === 'player' && (invoice.state === 'draft' || !(await isJobOfPlayer(db, access.shopId, invoice.jobId, access.userId)))) {
    throw createError({ statusCode: 404, message: 'Invoice not found.' })
  }
  return invoice
}
