import { and, asc, count, desc, eq, inArray, isNull, like, or, type SQL } from 'drizzle-orm'
import { jobListQuery, type JobListQuery } from '#shared/utils/schemas/jobs'
import { JOB_STATES, type JobState } from '#shared/utils/jobs/states'

// A shop's list is read far more often than it changes.
const answers = new VersionedAnswers()

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event)
  const query = await validQuery(event, jobListQuery)
  // Staff see the same list; a player sees only their own jobs.
  const viewer = access.role === 'player' ? access.userId : 'staff'
  const json = await answers.answer(access.shopId, `${viewer}\u0000${JSON.stringify(query)}`, () => listJobs(access, query))
  setResponseHeader(event, 'content-type', 'application/json')
  return json
})

async function listJobs(access: ShopAccess, query: JobListQuery) {
  const j = tables.jobs
  const c = tables.customers
  const a = tables.amps
  const isPlayer = access.role === 'player'
  // Everything but the status filter, so the counts show what each status chip would hold.
  const base: (SQL | undefined)[] = [
    eq(j.shopId, access.shopId),
    isNull(j.deletedAt),
    isPlayer ? eq(c.playerUserId, access.userId) : undefined,
    query.tech ? eq(j.assignedTo, query.tech) : undefined,
    query.customer ? eq(j.customerId, query.customer) : undefined,
    query.q ? or(like(j.complaint, likePattern(query.q)), like(c.name, likePattern(query.q)), like(a.serial, likePattern(query.q))) : undefined,
  ]
  const where = and(...base, query.status ? inArray(j.status, query.status) : undefined)
  const db = useDb()
  // One direction for the sort and its tie-breakers, so an index (jobs_list_*) walks them in order.
  const order = query.dir === 'asc' ? asc : desc
  const sortBy = query.sort === 'updatedAt' ? [order(j.updatedAt), order(j.id)] : [order(j[query.sort]), order(j.updatedAt), order(j.id)]
  let countQuery = db.select({ status: j.status, n: count() }).from(j).$dynamic()
  // The counts join a table only when a filter reads it.
  if (isPlayer || query.q) countQuery = countQuery.innerJoin(c, eq(c.id, j.customerId))
  if (query.q) countQuery = countQuery.leftJoin(a, eq(a.id, j.ampId))
  const [items, counts] = await Promise.all([
    db.select({
      id: j.id, customerId: j.customerId, ampId: j.ampId, complaint: j.complaint, promisedFor: j.promisedFor, assignedTo: j.assignedTo,
      priority: j.priority, status: j.status, version: j.version, createdAt: j.createdAt, updatedAt: j.updatedAt,
      customerName: c.name, ampDescription: a.description, ampSerial: a.serial,
    }).from(j).innerJoin(c, eq(c.id, j.customerId)).leftJoin(a, eq(a.id, j.ampId))
      .where(where)
      .orderBy(...sortBy)
      .limit(query.pageSize).offset((query.page - 1) * query.pageSize),
    countQuery.where(and(...base)).groupBy(j.status),
  ])
  const byStatus = Object.fromEntries(counts.map(r => [r.status, r.n])) as Partial<Record<JobState, number>>
  // The total is the counts of the statuses asked for: no third query.
  const total = ((query.status ?? JOB_STATES) as readonly JobState[]).reduce((sum, s) => sum + (byStatus[s] ?? 0), 0)
  return { items, total, page: query.page, pageSize: query.pageSize, counts: byStatus }
}
