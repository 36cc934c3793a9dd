import { and, count, desc, eq, inArray, isNull, or, type SQL } from 'drizzle-orm'
import type { ShopAccess } from './authz'

type Access = Pick<ShopAccess, 'userId' | 'shopId' | 'role'>

// Runs a person may see: the shop's for staff; for a player, their own and those on their jobs.
async function visible(access: Access): Promise<SQL | undefined> {
  const r = tables.procedureRuns
  if (access.role !== 'player') return eq(r.shopId, access.shopId)
  const jobs = await useDb().select({ id: tables.jobs.id }).from(tables.jobs)
    .innerJoin(tables.customers, eq(tables.customers.id, tables.jobs.customerId))
    .where(and(eq(tables.jobs.shopId, access.shopId), eq(tables.customers.playerUserId, access.userId)))
  const jobIds = jobs.map(j => j.id)
  return and(eq(r.shopId, access.shopId), jobIds.length ? or(eq(r.createdBy, access.userId), inArray(r.jobId, jobIds)) : eq(r.createdBy, access.userId))
}

/** Runs with their safety check: who acknowledged it (name), when, which items. */
export async function listRuns(access: Access, query: { job?: string, id?: string, page: number, pageSize: number }) {
  const r = tables.procedureRuns
  const g = tables.procedureGates
  const u = tables.users
  const where = and(await visible(access), isNull(r.deletedAt), query.job ? eq(r.jobId, query.job) : undefined, query.id ? eq(r.id, query.id) : undefined)
  const db = useDb()
  const [rows, [total]] = await Promise.all([
    db.select({ run: r, gate: g, gateBy: u.name }).from(r)
      .leftJoin(g, eq(g.id, r.gateId)).leftJoin(u, eq(u.id, g.createdBy))
      .where(where).orderBy(desc(r.createdAt), desc(r.id))
      .limit(query.pageSize).offset((query.page - 1) * query.pageSize),
    db.select({ n: count() }).from(r).where(where),
  ])
  const items = rows.map(({ run, gate, gateBy }) => ({
    ...publicRow(run),
    gate: gate
      ? { id: gate.id, createdBy: gate.createdBy, createdByName: gateBy ?? '', acknowledgedAt: gate.acknowledgedAt, items: gate.items, receivedAt: gate.createdAt }
      : null,
  }))
  return { items, total: total?.n ?? 0, page: query.page, pageSize: query.pageSize }
}

export async function findRun(access: Access, id: string) {
  const { items } = await listRuns(access, { id, page: 1, pageSize: 1 })
  if (!items[0]) throw createError({ statusCode: 404, message: 'Procedure run not found.' })
  return items[0]
}
