// How the server takes shop tube stock: lots, their tubes' readings, and matched sets, which leave
// stock when fitted to a job (the job's part is written in the same transaction).
import { createHash } from 'node:crypto'
import { and, eq, inArray, isNull } from 'drizzle-orm'
import type { EntityFields } from '#shared/utils/sync/entities'
import { setSpread, spreadAgrees } from '#shared/utils/bench/set-spread'
import { BUILTIN_LIBRARY } from '#shared/utils/tubes/library'
import { matchedSetPartDescription } from '#shared/utils/stock'
import { reject, type ApplyContext } from './context'
import { stampFor } from './conflicts'
import { mustExist, type EntityPolicy } from './entity-policies'

type Row = Record<string, unknown> & { id: string }
type SetFields = EntityFields<'matchedSets'> & { id: string }

/** The name of a Tubes library entry this shop can use (built-in or its own live entry). */
async function tubeTypeName(ctx: ApplyContext, id: string): Promise<string | undefined> {
  const builtin = BUILTIN_LIBRARY.find(t => t.id === id)
  if (builtin) return builtin.name
  const t = tables.tubes
  const [row] = await ctx.tx.select({ name: t.name }).from(t).where(and(eq(t.id, id), eq(t.shopId, ctx.shopId), isNull(t.deletedAt)))
  return row?.name
}

async function liveSet(ctx: ApplyContext, id: unknown) {
  if (typeof id !== 'string') return undefined
  const t = tables.matchedSets
  const [row] = await ctx.tx.select().from(t).where(and(eq(t.id, id), eq(t.shopId, ctx.shopId), isNull(t.deletedAt)))
  return row
}

const READING = ['plateVolts', 'gridVolts', 'amps', 'transconductance'] as const
const FIT_FIELDS = ['status', 'fittedJobId', 'fittedAt', 'priceCents'] as const
const kind = (size: number) => (size === 2 ? 'pair' : 'quad')

/** The part a fitted set becomes: a stable id per set, so it can never be written twice. */
export const fittedPartId = (setId: string) => {
  const h = createHash('sha256').update(`matched-set-part:${setId}`).digest('hex')
  return `${h.slice(0, 8)}-${h.slice(8, 12)}-5${h.slice(13, 16)}-a${h.slice(17, 20)}-${h.slice(20, 32)}`
}

async function checkStockTube(ctx: ApplyContext, next: Record<string, unknown>, before?: Row) {
  if (!before) await mustExist(ctx, 'tubeLots', next.lotId, 'lot')
  const setChanged = (before?.setId ?? null) !== (next.setId ?? null)
  if (before?.setId && (setChanged || READING.some(f => before[f] !== next[f]))) {
    const set = await liveSet(ctx, before.setId)
    if (set && set.tubeIds.includes(before.id)) reject(`tube ${String(before.label)} is in set ${set.label}: its reading is what matched it, so delete the set first`)
  }
  if (setChanged) await mustExist(ctx, 'matchedSets', next.setId, 'set', { mayBeNew: true })
}

async function checkNewSet(ctx: ApplyContext, set: SetFields) {
  if (set.status !== 'in-stock' || set.fittedJobId || set.fittedAt) reject('a new set starts in stock, fitted to no job')
  if (set.tubeIds.length !== set.size) reject(`a ${kind(set.size)} has ${set.size} tubes; ${set.tubeIds.length} were named`)
  if (new Set(set.tubeIds).size !== set.tubeIds.length) reject('a tube is named twice in the set')
  const t = tables.stockTubes
  const tubes = await ctx.tx.select().from(t).where(inArray(t.id, set.tubeIds))
  const lotIds = [...new Set(tubes.map(r => r.lotId))]
  const lots = lotIds.length ? await ctx.tx.select({ id: tables.tubeLots.id, tubeType: tables.tubeLots.tubeType }).from(tables.tubeLots).where(inArray(tables.tubeLots.id, lotIds)) : []
  for (const id of set.tubeIds) {
    const tube = tubes.find(r => r.id === id)
    if (!tube || tube.shopId !== ctx.shopId || tube.deletedAt) return reject('stock tube not found in this shop', 'missing')
    if (tube.setId !== set.id) reject(`tube ${tube.label} is not marked for this set (it is ${tube.setId ? 'in another set' : 'in no set'})`)
    const type = lots.find(l => l.id === tube.lotId)?.tubeType
    if (type !== set.tubeType) reject(`tube ${tube.label} is a ${type ?? 'tube of an unknown type'}, not a ${set.tubeType}`)
  }
  if (!spreadAgrees(set.spreadFraction, tubes.map(r => r.amps))) {
    reject(`the spread does not match the tubes' readings (they give ${(setSpread(tubes.map(r => r.amps)) * 100).toFixed(2)} %)`)
  }
  await mustExist(ctx, 'measurements', set.sorterResultId, 'sorter result')
}

/** Returning a fitted set to stock: only while its job is still open to change, and its invoice not paid. */
async function checkReturn(ctx: ApplyContext, set: SetFields, before: Row) {
  if (set.fittedJobId || set.fittedAt || set.priceCents !== null) reject('a set back in stock is fitted to no job and has no price')
  const jobId = String(before.fittedJobId)
  const [job] = await ctx.tx.select({ status: tables.jobs.status }).from(tables.jobs).where(and(eq(tables.jobs.id, jobId), eq(tables.jobs.shopId, ctx.shopId)))
  if (job?.status === 'closed') reject(`set ${String(before.label)} cannot go back to stock: its job is closed, and its parts are the service record`)
  const inv = tables.invoices
  const [paid] = await ctx.tx.select({ number: inv.number }).from(inv).where(and(eq(inv.jobId, jobId), eq(inv.shopId, ctx.shopId), eq(inv.state, 'paid')))
  if (paid) reject(`set ${String(before.label)} cannot go back to stock: the job's invoice ${paid.number} is paid with it`)
}

async function checkSet(ctx: ApplyContext, next: Record<string, unknown>, before?: Row) {
  const set = next as SetFields
  if (!before) return checkNewSet(ctx, set)
  if (before.status === 'fitted' && set.status === 'in-stock') return checkReturn(ctx, set, before)
  if (before.status === 'fitted' && FIT_FIELDS.some(f => JSON.stringify(before[f]) !== JSON.stringify(next[f]))) {
    reject(`set ${String(before.label)} is already fitted to a job: it has left stock`)
  }
  if (set.status === 'in-stock' && (set.fittedJobId || set.fittedAt)) reject('a set in stock is fitted to no job')
  if (set.status !== 'fitted' || before.status === 'fitted') return
  if (!set.fittedJobId) reject('say which job the set is fitted to')
  if (!set.fittedAt) reject('say when the set was fitted')
  await mustExist(ctx, 'jobs', set.fittedJobId, 'job')
  const [job] = await ctx.tx.select({ status: tables.jobs.status }).from(tables.jobs).where(eq(tables.jobs.id, set.fittedJobId!))
  if (job?.status === 'closed' || job?.status === 'cancelled') reject(`the job is ${job.status}: a set can be fitted only to an open job`)
}

/**
 * Fitting (in stock -> fitted): the job gets the set as one part, priced from the lots' cost unless
 * a price was set. Returning (fitted -> in stock): that part leaves the job. The part's id is the
 * set's, so each move writes it exactly once.
 */
async function fitPart(ctx: ApplyContext, next: Record<string, unknown>, before?: Row) {
  const set = next as SetFields
  const p = tables.jobParts
  const partId = fittedPartId(set.id)
  if (before?.status === 'fitted' && set.status === 'in-stock') {
    await ctx.tx.update(p).set({ deletedAt: ctx.now, version: ctx.version, updatedBy: ctx.userId })
      .where(and(eq(p.id, partId), eq(p.shopId, ctx.shopId), isNull(p.deletedAt)))
    return
  }
  if (!before || before.status === 'fitted' || set.status !== 'fitted') return
  const tubes = await ctx.tx.select({ lotId: tables.stockTubes.lotId }).from(tables.stockTubes).where(inArray(tables.stockTubes.id, set.tubeIds))
  const lotIds = [...new Set(tubes.map(r => r.lotId))]
  const lots = lotIds.length ? await ctx.tx.select({ id: tables.tubeLots.id, costCents: tables.tubeLots.costCents }).from(tables.tubeLots).where(inArray(tables.tubeLots.id, lotIds)) : []
  const cost = tubes.reduce((sum, r) => sum + (lots.find(l => l.id === r.lotId)?.costCents ?? 0), 0)
  const name = (await tubeTypeName(ctx, set.tubeType)) ?? set.tubeType
  const part: EntityFields<'jobParts'> = {
    jobId: set.fittedJobId!, description: matchedSetPartDescription(set.size, name, set.label), quantity: 1,
    unitCostCents: cost, unitPriceCents: set.priceCents ?? cost,
  }
  const stamp = stampFor(ctx)
  const fieldStamps = Object.fromEntries(Object.keys(part).map(k => [k, stamp]))
  // Fitted again after a return: the same part comes back, with this fit's job and price.
  const [old] = await ctx.tx.select({ id: p.id }).from(p).where(and(eq(p.id, partId), eq(p.shopId, ctx.shopId)))
  if (old) {
    await ctx.tx.update(p).set({ ...part, deletedAt: null, version: ctx.version, updatedBy: ctx.userId, updatedAt: ctx.now, fieldStamps }).where(eq(p.id, partId))
    return
  }
  await ctx.tx.insert(p).values({
    ...part, id: partId, shopId: ctx.shopId, version: ctx.version, createdBy: ctx.userId, updatedBy: ctx.userId,
    createdAt: ctx.now, updatedAt: ctx.now, fieldStamps,
  })
}

/** A lot goes only with none of its tubes in a set fitted to a job (those are on a job's record). */
async function checkLotDelete(ctx: ApplyContext, row: Row) {
  const t = tables.stockTubes
  const tubes = await ctx.tx.select({ setId: t.setId }).from(t).where(and(eq(t.lotId, row.id), eq(t.shopId, ctx.shopId), isNull(t.deletedAt)))
  const setIds = [...new Set(tubes.flatMap(x => (x.setId ? [x.setId] : [])))]
  if (!setIds.length) return
  const s = tables.matchedSets
  const [fitted] = await ctx.tx.select({ label: s.label }).from(s).where(and(inArray(s.id, setIds), eq(s.shopId, ctx.shopId), eq(s.status, 'fitted'), isNull(s.deletedAt)))
  if (fitted) reject(`this lot's tubes are in set ${fitted.label}, which is fitted to a job: return the set to stock first, or keep the lot`)
}

export const STOCK_POLICIES = {
  tubeLots: {
    table: tables.tubeLots,
    beforeDelete: checkLotDelete,
    async check(ctx, next, before) {
      if (!before && !(await tubeTypeName(ctx, String(next.tubeType)))) reject('that tube type is not in the Tubes library')
    },
  },
  stockTubes: {
    table: tables.stockTubes,
    check: checkStockTube,
    async beforeDelete(ctx, row) {
      const set = await liveSet(ctx, row.setId)
      if (set && set.tubeIds.includes(row.id)) reject(`tube ${String(row.label)} is in set ${set.label}: delete the set first`)
    },
  },
  matchedSets: {
    table: tables.matchedSets,
    // Before conflicts are weighed: a second fit is refused, whatever version the device saw.
    // Returning it to stock (status 'in-stock') is the one move a fitted set may make.
    guard(_ctx, fields, row) {
      if ((row as Row).status === 'fitted' && fields.status !== 'in-stock' && FIT_FIELDS.some(f => f in fields)) reject(`set ${String(row.label)} is already fitted to a job: it has left stock`)
    },
    beforeDelete(_ctx, row) {
      if ((row as Row).status === 'fitted') reject(`set ${String(row.label)} is fitted to a job, so it cannot be deleted: return it to stock first`)
    },
    check: checkSet,
    after: fitPart,
  },
} satisfies Record<'tubeLots' | 'stockTubes' | 'matchedSets', EntityPolicy>
