import { and, asc, desc, eq, inArray, isNull } from 'drizzle-orm'
import { STAFF_ROLES } from '#shared/utils/roles'

// Who sees a rig: its player (the rig is in their personal space), and the staff of a shop the
// player shares it with now (a live share, and the player still a member of that shop).

type RigRow = typeof tables.rigs.$inferSelect

/** The active shop, if the person is staff there (null otherwise). */
async function staffShop(userId: string, activeShopId: string | null | undefined): Promise<string | null> {
  if (!activeShopId) return null
  const m = tables.memberships
  const [row] = await useDb().select({ role: m.role }).from(m)
    .innerJoin(tables.shops, eq(tables.shops.id, m.shopId))
    .where(and(eq(m.shopId, activeShopId), eq(m.userId, userId), eq(tables.shops.kind, 'shop'), isNull(tables.shops.deletedAt)))
  return row && STAFF_ROLES.includes(row.role) ? activeShopId : null
}

/** Rigs shared with the shop now, with their player's id and name. */
async function sharedWith(shopId: string, rigId?: string) {
  const r = tables.rigs
  const s = tables.rigShares
  const m = tables.memberships
  return useDb().select({ rig: r, playerName: tables.users.name }).from(s)
    .innerJoin(r, and(eq(r.id, s.rigId), eq(r.shopId, s.shopId)))
    .innerJoin(m, and(eq(m.shopId, shopId), eq(m.userId, s.createdBy)))
    .innerJoin(tables.users, eq(tables.users.id, s.createdBy))
    .where(and(eq(s.sharedShopId, shopId), isNull(s.deletedAt), isNull(r.deletedAt), rigId ? eq(r.id, rigId) : undefined))
    .orderBy(asc(r.description))
}

async function ownRigs(userId: string, rigId?: string) {
  const space = await ensurePersonalSpace(useDb(), userId)
  const r = tables.rigs
  return useDb().select().from(r)
    .where(and(eq(r.shopId, space), eq(r.createdBy, userId), isNull(r.deletedAt), rigId ? eq(r.id, rigId) : undefined))
    .orderBy(asc(r.description))
}

const card = (rig: RigRow) => {
  const { fieldStamps: _f, shopId: _s, deletedAt: _d, ...rest } = rig
  return rest
}

/** GET /api/rigs: the person's own rigs, and (staff) the rigs shared with the active shop. */
export async function listRigs(userId: string, activeShopId: string | null | undefined) {
  const shop = await staffShop(userId, activeShopId)
  const own = await ownRigs(userId)
  const shared = shop ? await sharedWith(shop) : []
  return {
    items: [
      ...own.map(rig => ({ ...card(rig), access: 'own' as const, playerUserId: userId })),
      ...shared.map(({ rig, playerName }) => ({ ...card(rig), access: 'shared' as const, playerUserId: rig.createdBy, playerName })),
    ],
  }
}

/** GET /api/rigs/[id]: one rig with its sets, gigs and (for its player) shares and shop history; 404 when not visible. */
export async function rigDetail(userId: string, activeShopId: string | null | undefined, rigId: string) {
  const db = useDb()
  const [own] = await ownRigs(userId, rigId)
  let rig: RigRow | undefined = own
  let access: 'own' | 'shared' = 'own'
  if (!rig) {
    const shop = await staffShop(userId, activeShopId)
    const [shared] = shop ? await sharedWith(shop, rigId) : []
    rig = shared?.rig
    access = 'shared'
  }
  if (!rig) throw createError({ statusCode: 404, message: 'Rig not found.' })
  const strip = <R extends { fieldStamps: unknown, shopId: string, deletedAt: Date | null }>(row: R) => {
    const { fieldStamps: _f, shopId: _s, deletedAt: _d, ...rest } = row
    return rest
  }
  const ts = tables.rigTubeSets
  const g = tables.rigGigs
  const sh = tables.rigShares
  const [sets, gigs] = await Promise.all([
    db.select().from(ts).where(and(eq(ts.rigId, rig.id), eq(ts.shopId, rig.shopId), isNull(ts.deletedAt))).orderBy(desc(ts.fittedOn)),
    db.select().from(g).where(and(eq(g.rigId, rig.id), eq(g.shopId, rig.shopId), isNull(g.deletedAt))).orderBy(desc(g.playedOn)),
  ])
  const base = { ...card(rig), access, sets: sets.map(strip), gigs: gigs.map(strip) }
  if (access === 'shared') return { ...base, shares: [], history: [], suggestions: await suggestionsFor(rig.id, activeShopId!) }
  const shares = await db.select({ id: sh.id, sharedShopId: sh.sharedShopId, shopName: tables.shops.name, createdAt: sh.createdAt })
    .from(sh).innerJoin(tables.shops, eq(tables.shops.id, sh.sharedShopId))
    .where(and(eq(sh.rigId, rig.id), eq(sh.shopId, rig.shopId), isNull(sh.deletedAt)))
  return { ...base, shares, history: await shopHistory(rig.id), suggestions: await suggestionsFor(rig.id) }
}

/** Retube thresholds shops suggested for the rig, newest first (`shopId`: that shop's only). */
async function suggestionsFor(rigId: string, shopId?: string) {
  const s = tables.rigSuggestions
  return useDb().select({
    id: s.id, shopId: s.shopId, shopName: tables.shops.name, retubeHours: s.retubeHours, retubeMonths: s.retubeMonths,
    note: s.note, suggestedBy: s.suggestedBy, createdAt: s.createdAt,
  }).from(s).innerJoin(tables.shops, eq(tables.shops.id, s.shopId))
    .where(and(eq(s.rigId, rigId), isNull(s.deletedAt), shopId ? eq(s.shopId, shopId) : undefined))
    .orderBy(desc(s.createdAt)).limit(20)
}

/**
 * The shops' jobs on amps linked to this rig, as the player may see them: status, dates, bench
 * readings and the notes the shop wrote for the customer. Nothing else of the shop's records.
 */
async function shopHistory(rigId: string) {
  const db = useDb()
  const a = tables.amps
  const j = tables.jobs
  const jobs = await db.select({ id: j.id, shopId: j.shopId, shopName: tables.shops.name, status: j.status, createdAt: j.createdAt, updatedAt: j.updatedAt, promisedFor: j.promisedFor })
    .from(j).innerJoin(a, and(eq(a.id, j.ampId), eq(a.shopId, j.shopId))).innerJoin(tables.shops, eq(tables.shops.id, j.shopId))
    .where(and(eq(a.rigId, rigId), isNull(a.deletedAt), isNull(j.deletedAt))).orderBy(desc(j.createdAt))
  if (!jobs.length) return []
  const ids = jobs.map(x => x.id)
  const m = tables.measurements
  const n = tables.notes
  const [readings, notes] = await Promise.all([
    db.select({ jobId: m.jobId, tool: m.tool, label: m.label, outputs: m.outputs, createdAt: m.createdAt }).from(m)
      .where(and(inArray(m.jobId, ids), isNull(m.deletedAt))).orderBy(asc(m.createdAt)),
    db.select({ jobId: n.jobId, title: n.title, body: n.body, createdAt: n.createdAt }).from(n)
      .where(and(inArray(n.jobId, ids), eq(n.visibility, 'customer'), isNull(n.deletedAt))).orderBy(asc(n.createdAt)),
  ])
  return jobs.map(job => ({
    ...job,
    readings: readings.filter(r => r.jobId === job.id),
    notes: notes.filter(x => x.jobId === job.id),
  }))
}
