import { and, asc, count, desc, eq, inArray, isNull, like, or, type SQL } from 'drizzle-orm'
import { jobListQuery } from '#shared/utils/schemas/jobs'
import type { JobState } from '#shared/utils/jobs/states'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event)
  const query = await validQuery(event, jobListQuery)
  const j = tables.jobs
  const c = tables.customers
  const a = tables.amps
  // Everything but the status filter, so the counts show what each status chip would hold.
  const base: (SQL | undefined)[] = [
    eq(j.shopId, access.shopId),
    isNull(j.deletedAt),
    access.role === 'player' ? eq(c.playerUserId, access.userId) : undefined,
    query.tech ? eq(j.assignedTo, query.tech) : undefined,
    query.customer ? eq(j.customerId, query.customer) : undefined,
    query.q ? or(like(j.complaint, likePattern(query.q)), like(c.name, likePattern(query.q)), like(a.serial, likePattern(query.q))) : undefined,
  ]
  const where = and(...base, query.status ? inArray(j.status, query.status) : undefined)
  const db = useDb()
  const from = () => db.select({ n: count() }).from(j).innerJoin(c, eq(c.id, j.customerId)).leftJoin(a, eq(a.id, j.ampId))
  const order = query.dir === 'asc' ? asc : desc
  const [items, [total], counts] = await Promise.all([
    db.select({
      id: j.id, customerId: j.customerId, ampId: j.ampId, complaint: j.complaint, promisedFor: j.promisedFor, assignedTo: j.assignedTo,
      priority: j.priority, status: j.status, version: j.version, createdAt: j.createdAt, updatedAt: j.updatedAt,
      customerName: c.name, ampDescription: a.description, ampSerial: a.serial,
    }).from(j).innerJoin(c, eq(c.id, j.customerId)).leftJoin(a, eq(a.id, j.ampId))
      .where(where)
      .orderBy(order(j[query.sort]), desc(j.updatedAt), asc(j.id))
      .limit(query.pageSize).offset((query.page - 1) * query.pageSize),
    from().where(where),
    db.select({ status: j.status, n: count() }).from(j).innerJoin(c, eq(c.id, j.customerId)).leftJoin(a, eq(a.id, j.ampId))
      .where(and(...base)).groupBy(j.status),
  ])
  return {
    items,
    total: total?.n ?? 0,
    page: query.page,
    pageSize: query.pageSize,
    counts: Object.fromEntries(counts.map(r => [r.status, r.n])) as Partial<Record<JobState, number>>,
  }
})
