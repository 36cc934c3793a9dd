import { createHash } from 'node:crypto'
import { and, eq, inArray, sql } from 'drizzle-orm'
import { canonicalJson, isMutationName, MUTATION_ARGS, SYNC_SCHEMA_VERSION, type Mutation, type MutationName, type MutationResult, type PushBody, type PushReply } from '#shared/utils/sync/protocol'
import { entityOf } from '#shared/utils/sync/entities'
import type { Role } from '#shared/utils/roles'
import { Rejection, type ApplyContext, type ApplyOutcome } from './context'
import type { Tx } from '../db'
import { APPLY, needsSavepoint } from './apply'
import { CreateIds } from './create-ids'
import { HeldInserts } from './held-inserts'

export const payloadHash = (m: Mutation) => createHash('sha256').update(canonicalJson({ uuid: m.uuid, name: m.name, args: m.args, baseVersion: m.baseVersion ?? null })).digest('hex')

/** The client must belong to this user and shop; the first push (or pull) registers it. */
export async function registerClient(clientId: string, userId: string, shopId: string) {
  const db = useDb()
  const find = async () => (await db.select().from(tables.syncClients).where(eq(tables.syncClients.id, clientId)))[0]
  // Read first: a device is new once, and a write on every pull and push is a round trip and a commit.
  let c = await find()
  if (!c) {
    await db.insert(tables.syncClients).ignore().values({ id: clientId, userId, shopId })
    c = await find()
  }
  if (!c || c.userId !== userId || c.shopId !== shopId) {
    throw createError({ statusCode: 403, message: 'This device id belongs to another account or shop. Sign in again to start a fresh device store.' })
  }
  return c
}

type Access = { userId: string, shopId: string, role: Role }
type LogRow = typeof tables.syncMutations.$inferInsert
type Logged = Pick<LogRow, 'payloadHash' | 'status' | 'reason'>

// The uuid column compares without case, so the batch's own checks do too.
const uuidKey = (uuid: string) => uuid.toLowerCase()

/**
 * What the log held before this push, read once for the whole batch: this client's entries for
 * the numbers it may resend (up to lmid), and which of the batch's other uuids are taken.
 */
async function loggedBefore(tx: Tx, clientId: string, lmid: number, mutations: Mutation[]) {
  const t = tables.syncMutations
  const numbers = [...new Set(mutations.filter(m => m.id <= lmid).map(m => m.id))]
  const uuids = [...new Set(mutations.filter(m => m.id > lmid).map(m => m.uuid))]
  const rows = numbers.length
    ? await tx.select({ mutationId: t.mutationId, payloadHash: t.payloadHash, status: t.status, reason: t.reason }).from(t)
      .where(and(eq(t.clientId, clientId), inArray(t.mutationId, numbers)))
    : []
  const taken = uuids.length ? await tx.select({ uuid: t.uuid }).from(t).where(inArray(t.uuid, uuids)) : []
  return {
    byNumber: new Map<number, Logged>(rows.map(r => [r.mutationId, r])),
    uuids: new Set(taken.map(r => uuidKey(r.uuid))),
  }
}

/**
 * One transaction per push: the client row and then the shop's version row are locked (always
 * in that order), every mutation is applied, its log entry is written with the others', and lmid
 * advances with them.
 */
async function applyBatch(access: Access, clientId: string, mutations: Mutation[]): Promise<MutationResult[]> {
  let afterCommit: (() => Promise<unknown>)[] = []
  const results = await withRetry(() => useDb().transaction(async (tx) => {
    // A retried transaction starts over, and so does its after-commit work.
    afterCommit = []
    const [client] = await tx.select({ lmid: tables.syncClients.lmid }).from(tables.syncClients)
      .where(eq(tables.syncClients.id, clientId)).for('update')
    let lmid = client?.lmid ?? 0
    let version = await lockShopVersion(tx, access.shopId)
    const startVersion = version
    const startLmid = lmid
    // Entries of this batch join these as they are made: nothing in between reads the log table.
    const { byNumber: logged, uuids: takenUuids } = await loggedBefore(tx, clientId, lmid, mutations)
    const createIds = CreateIds.of(mutations.filter(m => m.id > startLmid))
    const held = new HeldInserts()
    const log: LogRow[] = []
    const results: MutationResult[] = []
    for (const m of mutations) {
      const hash = payloadHash(m)
      if (m.id <= lmid) {
        const entry = logged.get(m.id)
        if (entry && entry.payloadHash !== hash) {
          throw createError({ statusCode: 422, message: `Mutation ${m.id} was already used for a different change.` })
        }
        results.push({ id: m.id, status: 'duplicate', was: entry?.status ?? 'applied', ...(entry?.reason ? { reason: entry.reason } : {}) })
        continue
      }
      if (m.id > lmid + 1) break
      if (takenUuids.has(uuidKey(m.uuid))) throw createError({ statusCode: 422, message: `Mutation ${m.uuid} was already applied under another number.` })

      const next = version + 1
      if (!held.canWaitFor(m.name as MutationName)) await held.write(tx)
      const outcome = await applyOne(tx, { ...access, clientId, version: next, mutationUuid: m.uuid, baseVersion: m.baseVersion, createIds, held }, m, afterCommit)
      if (outcome.touched) {
        version = next
        rememberWrites(createIds, m)
      }
      const entry: LogRow = {
        clientId, mutationId: m.id, uuid: m.uuid, name: m.name, payloadHash: hash, status: outcome.status,
        reason: outcome.reason?.slice(0, 500) ?? null, version: outcome.touched ? next : null, userId: access.userId,
      }
      log.push(entry)
      logged.set(m.id, entry)
      takenUuids.add(uuidKey(m.uuid))
      lmid = m.id
      results.push({ id: m.id, status: outcome.status, ...(outcome.reason ? { reason: outcome.reason } : {}) })
    }
    await held.write(tx)
    await insertRows(tx, tables.syncMutations, log)
    if (version !== startVersion) await bumpShopVersion(tx, access.shopId, version)
    if (lmid !== startLmid) await tx.update(tables.syncClients).set({ lmid, lastSeenAt: sql`CURRENT_TIMESTAMP(3)` }).where(eq(tables.syncClients.id, clientId))
    return results
  }))
  // Only mutations applied by this push queue work: a duplicate is skipped above, so it sends nothing.
  runAfterCommit(afterCommit)
  return results
}

/** What an applied mutation wrote, for the later creates' id checks. */
function rememberWrites(createIds: CreateIds, m: Mutation) {
  const entity = entityOf(m.name)
  if (entity?.verb === 'create') createIds.created(entity.table, (m.args as { id: string }).id)
  if (needsSavepoint(m.name as MutationName)) createIds.forgetFree()
}

/** One mutation's outcome; a rejection is an outcome, and its after-commit work is dropped. */
async function applyOne(tx: Tx, base: Omit<ApplyContext, 'tx' | 'now' | 'afterCommit'>, m: Mutation, afterCommit: (() => Promise<unknown>)[]): Promise<ApplyOutcome> {
  const parsed = MUTATION_ARGS[m.name as keyof typeof MUTATION_ARGS].safeParse(m.args)
  if (!parsed.success) return { status: 'rejected', touched: false, reason: zodMessage(parsed.error) }
  const apply = APPLY[m.name as keyof typeof APPLY] as (ctx: ApplyContext, args: unknown) => Promise<ApplyOutcome>
  const queued: (() => Promise<unknown>)[] = []
  const run = (t: Tx) => apply({ ...base, tx: t, now: new Date(), afterCommit: queued }, parsed.data)
  try {
    // A savepoint, so a rejected mutation leaves nothing behind but its log entry.
    const outcome = needsSavepoint(m.name as MutationName) ? await tx.transaction(run) : await run(tx)
    afterCommit.push(...queued)
    return outcome
  }
  catch (error) {
    if (!(error instanceof Rejection)) throw error
    return { status: 'rejected', touched: false, reason: error.message }
  }
}

export async function handlePush(access: Access, body: PushBody): Promise<PushReply> {
  if (body.schemaVersion !== SYNC_SCHEMA_VERSION) {
    throw createError({ statusCode: 426, message: 'This version of the app is out of date. Reload to update; your changes stay on the device.' })
  }
  const unknown = body.mutations.find(m => !isMutationName(m.name))
  if (unknown) throw createError({ statusCode: 426, message: `Unknown change "${unknown.name}". Reload to update the app; your changes stay on the device.` })

  await withRetry(async () => {
    await registerClient(body.clientId, access.userId, access.shopId)
    await ensureShopVersionRow(access.shopId)
  })
  const results = await applyBatch(access, body.clientId, [...body.mutations].sort((a, b) => a.id - b.id))
  const [client] = await withRetry(() => useDb().select({ lmid: tables.syncClients.lmid }).from(tables.syncClients).where(eq(tables.syncClients.id, body.clientId)))
  return { lmid: client?.lmid ?? 0, results }
}
