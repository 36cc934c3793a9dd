import { and, asc, count, eq, isNull, like } from 'drizzle-orm'
import { z } from 'zod'
import { searchQuery } from '#shared/utils/schemas/jobs'

const ampQuery = searchQuery.extend({ customer: z.uuid({ message: 'must be an id' }).optional() })

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('amps', 'read'))
  const query = await validQuery(event, ampQuery)
  const a = tables.amps
  const where = and(eq(a.shopId, access.shopId), isNull(a.deletedAt),
    query.customer ? eq(a.customerId, query.customer) : undefined,
    query.q ? like(a.serial, likePattern(query.q)) : undefined)
  const db = useDb()
  const [rows, [total]] = await Promise.all([
    db.select().from(a).where(where).orderBy(asc(a.serial), asc(a.id)).limit(query.pageSize).offset((query.page - 1) * query.pageSize),
    db.select({ n: count() }).from(a).where(where),
  ])
  return { items: rows.map(publicRow), total: total?.n ?? 0, page: query.page, pageSize: query.pageSize }
})
