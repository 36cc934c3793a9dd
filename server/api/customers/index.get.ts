import { and, asc, count, eq, isNull, like, or } from 'drizzle-orm'
import { searchQuery } from '#shared/utils/schemas/jobs'

export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor('customers', 'read'))
  const query = await validQuery(event, searchQuery)
  const c = tables.customers
  const where = and(eq(c.shopId, access.shopId), isNull(c.deletedAt),
    query.q ? or(like(c.name, likePattern(query.q)), like(c.email, likePattern(query.q))) : undefined)
  const db = useDb()
  const [rows, [total]] = await Promise.all([
    db.select().from(c).where(where).orderBy(asc(c.name), asc(c.id)).limit(query.pageSize).offset((query.page - 1) * query.pageSize),
    db.select({ n: count() }).from(c).where(where),
  ])
  return { items: rows.map(publicRow), total: total?.n ?? 0, page: query.page, pageSize: query.pageSize }
})
