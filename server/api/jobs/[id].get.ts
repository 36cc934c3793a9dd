import { and, asc, desc, eq, isNull, ne } from 'drizzle-orm'
import type { AnyMySqlColumn } from 'drizzle-orm/mysql-core'
import { idParams } from '#shared/utils/schemas/records'
import { invoiceTotals } from '#shared/utils/jobs/money'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event)
  const { id } = await validParams(event, idParams)
  const db = useDb()
  const player = access.role === 'player'
  if (player && !(await isJobOfPlayer(db, access.shopId, id, access.userId))) throw createError({ statusCode: 404, message: 'Job not found.' })
  const job = await findShopJob(db, access.shopId, id)
  const inJob = (t: { shopId: AnyMySqlColumn, jobId: AnyMySqlColumn }) => and(eq(t.shopId, access.shopId), eq(t.jobId, id))
  const [[customer], [amp], parts, labour, events, notes, measurements, invoices, settings] = await Promise.all([
    db.select().from(tables.customers).where(and(eq(tables.customers.id, job.customerId), eq(tables.customers.shopId, access.shopId))),
    db.select().from(tables.amps).where(and(eq(tables.amps.id, job.ampId), eq(tables.amps.shopId, access.shopId))),
    db.select().from(tables.jobParts).where(and(inJob(tables.jobParts), isNull(tables.jobParts.deletedAt))).orderBy(asc(tables.jobParts.createdAt)),
    db.select().from(tables.jobLabour).where(and(inJob(tables.jobLabour), isNull(tables.jobLabour.deletedAt))).orderBy(asc(tables.jobLabour.createdAt)),
    db.select().from(tables.jobEvents).where(inJob(tables.jobEvents)).orderBy(asc(tables.jobEvents.version)),
    // Players see only the notes written for the customer.
    db.select().from(tables.notes).where(and(inJob(tables.notes), isNull(tables.notes.deletedAt), player ? eq(tables.notes.visibility, 'customer') : undefined)).orderBy(asc(tables.notes.createdAt)),
    db.select().from(tables.measurements).where(and(inJob(tables.measurements), isNull(tables.measurements.deletedAt))).orderBy(asc(tables.measurements.createdAt)),
    db.select().from(tables.invoices).where(and(inJob(tables.invoices), player ? ne(tables.invoices.state, 'draft') : undefined)).orderBy(desc(tables.invoices.createdAt)),
    shopSettingsOf(db, access.shopId),
  ])
  return {
    ...publicRow(job),
    customer: customer ? publicRow(customer) : null,
    amp: amp ? publicRow(amp) : null,
    parts: parts.map(publicRow),
    labour: labour.map(publicRow),
    events,
    notes: notes.map(publicRow),
    measurements: measurements.map(publicRow),
    invoices,
    // The same rule and settings an invoice made now would use, for every role that sees the job.
    totals: { ...invoiceTotals(parts, labour, settings.taxRateBasisPoints), taxRateBasisPoints: settings.taxRateBasisPoints, currency: settings.currency },
  }
})
