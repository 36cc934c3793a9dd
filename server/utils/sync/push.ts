import { createHash } from 'node:crypto'
import { and, eq, sql } from 'drizzle-orm'
import { canonicalJson, isMutationName, MUTATION_ARGS, SYNC_SCHEMA_VERSION, type Mutation, type MutationResult, type PushBody, type PushReply } from '#shared/utils/sync/protocol'
import type { Role } from '#shared/utils/roles'
import { Rejection, type ApplyContext, type ApplyOutcome } from './context'
import { APPLY } from './apply'

export const payloadHash = (m: Mutation) => createHash('sha256').update(canonicalJson({ uuid: m.uuid, name: m.name, args: m.args, baseVersion: m.baseVersion ?? null })).digest('hex')

/** The client must belong to this user and shop; the first push (or pull) registers it. */
export async function registerClient(clientId: string, userId: string, shopId: string) {
  const db = useDb()
  await db.insert(tables.syncClients).ignore().values({ id: clientId, userId, shopId })
  const [c] = await db.select().from(tables.syncClients).where(eq(tables.syncClients.id, clientId))
  if (!c || c.userId !== userId || c.shopId !== shopId) {
    throw createError({ statusCode: 403, message: 'This device id belongs to another account or shop. Sign in again to start a fresh device store.' })
  }
  return c
}

type Access = { userId: string, shopId: string, role: Role }

/**
 * One transaction per push: the client row and then the shop's version row are locked (always
 * in that order), every mutation is applied with its log entry, and lmid advances with them.
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
    const results: MutationResult[] = []
    for (const m of mutations) {
      const hash = payloadHash(m)
      if (m.id <= lmid) {
        const [logged] = await tx.select().from(tables.syncMutations)
          .where(and(eq(tables.syncMutations.clientId, clientId), eq(tables.syncMutations.mutationId, m.id)))
        if (logged && logged.payloadHash !== hash) {
          throw createError({ statusCode: 422, message: `Mutation ${m.id} was already used for a different change.` })
        }
        results.push({ id: m.id, status: 'duplicate', was: logged?.status ?? 'applied', ...(logged?.reason ? { reason: logged.reason } : {}) })
        continue
      }
      if (m.id > lmid + 1) break
      const [sameUuid] = await tx.select({ clientId: tables.syncMutations.clientId }).from(tables.syncMutations).where(eq(tables.syncMutations.uuid, m.uuid))
      if (sameUuid) throw createError({ statusCode: 422, message: `Mutation ${m.uuid} was already applied under another number.` })

      const next = version + 1
      let outcome: ApplyOutcome
      const parsed = MUTATION_ARGS[m.name as keyof typeof MUTATION_ARGS].safeParse(m.args)
      if (!parsed.success) {
        outcome = { status: 'rejected', touched: false, reason: zodMessage(parsed.error) }
      }
      else {
        try {
          const apply = APPLY[m.name as keyof typeof APPLY] as (ctx: ApplyContext, args: unknown) => Promise<ApplyOutcome>
          const queued: (() => Promise<unknown>)[] = []
          // A savepoint, so a rejected mutation leaves nothing behind but its log entry.
          outcome = await tx.transaction(inner => apply({ tx: inner, ...access, clientId, version: next, mutationUuid: m.uuid, baseVersion: m.baseVersion, now: new Date(), afterCommit: queued }, parsed.data))
          afterCommit.push(...queued)
        }
        catch (error) {
          if (!(error instanceof Rejection)) throw error
          outcome = { status: 'rejected', touched: false, reason: error.message }
        }
      }
      if (outcome.touched) version = next
      await tx.insert(tables.syncMutations).values({
        clientId, mutationId: m.id, uuid: m.uuid, name: m.name, payloadHash: hash, status: outcome.status,
        reason: outcome.reason?.slice(0, 500) ?? null, version: outcome.touched ? next : null, userId: access.userId,
      })
      lmid = m.id
      results.push({ id: m.id, status: outcome.status, ...(outcome.reason ? { reason: outcome.reason } : {}) })
    }
    if (version !== startVersion) await bumpShopVersion(tx, access.shopId, version)
    if (lmid !== startLmid) await tx.update(tables.syncClients).set({ lmid, lastSeenAt: sql`CURRENT_TIMESTAMP(3)` }).where(eq(tables.syncClients.id, clientId))
    return results
  }))
  // Only mutations applied by this push queue work: a duplicate is skipped above, so it sends nothing.
  runAfterCommit(afterCommit)
  return results
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
