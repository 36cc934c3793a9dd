// The device side of sync: every change is saved locally first (outbox + optimistic view in
// one transaction), then pushed exactly once; pulls rebase the view on the server's rows.
import { MAX_PUSH_MUTATIONS, SYNC_SCHEMA_VERSION, type MutationResult, type PullReply, type PushReply, type SyncedTable } from '#shared/utils/sync/wire'
import type { MutationArgs, MutationName } from '#shared/utils/sync/protocol'
import type { ConflictRow, LocalDb, MetaRow, OutboxRow, RejectionRow, ServerRow } from './local-db'
import { VIEW_TABLES } from './local-db'
import { key, reduce, serverToView, targetsOf, type ViewRow } from './reducers'

export interface TransportReply { status: number, body: unknown }
/** Sends a JSON body to a sync route; throws when the request never got an answer. */
export type Transport = (path: '/api/sync/push' | '/api/sync/pull', body: unknown) => Promise<TransportReply>

export class SyncHttpError extends Error {
  constructor(public status: number, message: string) {
    super(message)
  }
}

export interface EngineOptions {
  db: LocalDb
  userId: string
  shopId: string
  transport: Transport
  /** Only used for display timestamps; ordering never depends on the device clock. */
  now?: () => Date
  uuid?: () => string
}

const defaultUuid = () => globalThis.crypto.randomUUID()

export class SyncEngine {
  readonly db: LocalDb
  readonly userId: string
  readonly shopId: string
  private transport: Transport
  private now: () => Date
  private uuid: () => string
  private needsRebase = new Set<string>()

  constructor(o: EngineOptions) {
    this.db = o.db
    this.userId = o.userId
    this.shopId = o.shopId
    this.transport = o.transport
    this.now = o.now ?? (() => new Date())
    this.uuid = o.uuid ?? defaultUuid
  }

  private viewTables() {
    return VIEW_TABLES.map(t => this.db.table(t))
  }

  /** The per-shop meta row; a new (or evicted) database gets a brand-new client id. */
  async meta(): Promise<MetaRow> {
    return this.db.transaction('rw', this.db.meta, async () => {
      const found = await this.db.meta.get(this.shopId)
      if (found) return found
      const fresh: MetaRow = { shopId: this.shopId, clientId: this.uuid(), nextId: 1, cookie: null, lmid: 0, lastSyncedAt: null }
      await this.db.meta.add(fresh)
      return fresh
    })
  }

  /** Save one change on this device. Resolves once it is durable locally. */
  async mutate<N extends MutationName>(name: N, args: MutationArgs<N>, baseVersion?: number): Promise<OutboxRow> {
    const db = this.db
    return db.transaction('rw', [db.meta, db.outbox, ...this.viewTables()], async () => {
      const meta = await this.meta()
      await db.meta.update(this.shopId, { nextId: meta.nextId + 1 })
      const conflict = name === 'conflict.resolve' ? await db.conflicts.get((args as { id: string }).id) : undefined
      const row: OutboxRow = {
        shopId: this.shopId, id: meta.nextId, uuid: this.uuid(), name, args: args as Record<string, unknown>,
        ...(baseVersion !== undefined ? { baseVersion } : {}),
        targets: targetsOf({ name, args: args as Record<string, unknown> }, conflict),
        createdAt: this.now().toISOString(),
      }
      await db.outbox.add(row)
      for (const target of row.targets) {
        const [table, id] = target.split(':') as [SyncedTable, string]
        const current = await db.table<ViewRow, string>(table).get(id)
        const next = reduce(table, current, row, { userId: this.userId, shopId: this.shopId, conflict })
        if (next) await db.table<ViewRow, string>(table).put(next)
      }
      return row
    })
  }

  /** Changes the server has not answered yet. */
  pendingCount(): Promise<number> {
    return this.db.outbox.where('shopId').equals(this.shopId).filter(m => !m.sent).count()
  }

  private async call<T>(path: '/api/sync/push' | '/api/sync/pull', body: unknown): Promise<T> {
    const r = await this.transport(path, body)
    if (r.status >= 200 && r.status < 300) return r.body as T
    const message = (r.body as { message?: unknown } | null)?.message
    throw new SyncHttpError(r.status, typeof message === 'string' ? message : `sync answered ${r.status}`)
  }

  /** Send the outbox, in order, until it is empty or the server stops taking it. */
  async push(): Promise<{ sent: number, results: MutationResult[] }> {
    const meta = await this.meta()
    const all: MutationResult[] = []
    for (;;) {
      const batch = await this.db.outbox.where('[shopId+id]').between([this.shopId, 0], [this.shopId, Infinity]).filter(m => !m.sent).limit(MAX_PUSH_MUTATIONS).toArray()
      if (!batch.length) break
      const reply = await this.call<PushReply>('/api/sync/push', {
        clientId: meta.clientId, shopId: this.shopId, schemaVersion: SYNC_SCHEMA_VERSION,
        mutations: batch.map(m => ({ id: m.id, uuid: m.uuid, name: m.name, args: m.args, ...(m.baseVersion !== undefined ? { baseVersion: m.baseVersion } : {}) })),
      })
      await this.settle(batch, reply.results)
      all.push(...reply.results)
      if (!reply.results.length) break
    }
    return { sent: all.length, results: all }
  }

  /** Mark answered changes sent (the next pull drops them); rejected ones go to the rejections list. */
  private async settle(batch: OutboxRow[], results: MutationResult[]) {
    const byId = new Map(batch.map(m => [m.id, m]))
    const db = this.db
    await db.transaction('rw', db.outbox, db.rejections, async () => {
      for (const r of results) {
        const m = byId.get(r.id)
        if (!m) continue
        const rejected = r.status === 'rejected' || (r.status === 'duplicate' && r.was === 'rejected')
        if (rejected && !(await db.rejections.where('uuid').equals(m.uuid).count())) {
          await db.rejections.add({ shopId: this.shopId, uuid: m.uuid, name: m.name, args: m.args, reason: r.reason ?? 'refused by the server', at: this.now().toISOString() } satisfies RejectionRow)
        }
        await db.outbox.update([this.shopId, m.id], { sent: true })
        m.targets.forEach(t => this.needsRebase.add(t))
      }
    })
  }

  /** Fetch the server's changes since the last cursor, page by page, and rebase the view. */
  async pull(): Promise<{ changes: number, reset: boolean }> {
    let total = 0
    let wasReset = false
    for (;;) {
      const meta = await this.meta()
      const reply = await this.call<PullReply>('/api/sync/pull', { clientId: meta.clientId, shopId: this.shopId, schemaVersion: SYNC_SCHEMA_VERSION, cookie: meta.cookie })
      wasReset ||= reply.reset
      await this.applyPull(reply)
      total += reply.changes.length
      if (!reply.more) break
    }
    return { changes: total, reset: wasReset }
  }

  private async applyPull(reply: PullReply) {
    const db = this.db
    await db.transaction('rw', [db.meta, db.server, db.outbox, ...this.viewTables()], async () => {
      // A device that holds no server rows yet (its first sync) has nothing to clear: its view is
      // only its pending changes, which the rebase below redoes. Clearing every table costs a
      // slow phone's first screen about as much as writing the page.
      if (reply.reset && await db.server.where('shopId').equals(this.shopId).limit(1).count()) {
        await db.server.where('shopId').equals(this.shopId).delete()
        for (const t of VIEW_TABLES) await db.table(t).where('shopId').equals(this.shopId).delete()
      }
      const touched = new Set<string>(this.needsRebase)
      // One bulk write per page: a put per row kept the first screen's main thread busy.
      await db.server.bulkPut(reply.changes.map(c => ({ table: c.table, id: c.id, shopId: this.shopId, version: c.version, deleted: c.deleted, data: c.data } satisfies ServerRow)))
      for (const c of reply.changes) touched.add(key(c.table, c.id))
      await db.meta.update(this.shopId, { cookie: reply.cookie, lmid: reply.lmid, lastSyncedAt: this.now().toISOString() })
      // Once the last page is in, answered changes the server applied (lmid, from this pull's
      // snapshot) are part of the server rows on this device and leave the outbox.
      const outbox = await db.outbox.where('[shopId+id]').between([this.shopId, 0], [this.shopId, Infinity]).toArray()
      const confirmed = reply.more ? [] : outbox.filter(m => m.sent && m.id <= reply.lmid)
      await db.outbox.bulkDelete(confirmed.map(m => [this.shopId, m.id] as [string, number]))
      confirmed.forEach(m => m.targets.forEach(t => touched.add(t)))
      const pending = outbox.filter(m => !confirmed.includes(m))
      if (reply.reset) pending.forEach(m => m.targets.forEach(t => touched.add(t)))
      else pending.forEach(m => m.targets.forEach(t => touched.has(t) || touched.add(t)))
      await this.rebase([...touched], pending, reply.lmid)
      this.needsRebase.clear()
    })
  }

  /** View = server row, then every still-pending change the server has not applied, in order. */
  private async rebase(keys: string[], pending: OutboxRow[], lmid: number) {
    const db = this.db
    const waiting = pending.filter(m => m.id > lmid)
    const ids = keys.map(k => k.split(':') as [SyncedTable, string])
    const servers = await db.server.bulkGet(ids)
    const puts = new Map<SyncedTable, ViewRow[]>()
    const deletes = new Map<SyncedTable, string[]>()
    for (const [i, [table, id]] of ids.entries()) {
      const k = keys[i]!
      const s = servers[i]
      let row: ViewRow | undefined = s ? serverToView(s) : undefined
      for (const m of waiting) {
        if (!m.targets.includes(k)) continue
        const conflict = m.name === 'conflict.resolve' ? await db.conflicts.get(String(m.args.id)) as ConflictRow | undefined : undefined
        row = reduce(table, row, m, { userId: this.userId, shopId: this.shopId, conflict })
      }
      if (row) puts.set(table, puts.get(table) ?? []).get(table)!.push(row)
      else deletes.set(table, deletes.get(table) ?? []).get(table)!.push(id)
    }
    for (const [table, rows] of puts) await db.table<ViewRow, string>(table).bulkPut(rows)
    for (const [table, gone] of deletes) await db.table(table).bulkDelete(gone)
  }

  /** Rebuild the whole view from server rows and the outbox (after a restart). */
  async rebuild() {
    const db = this.db
    await db.transaction('rw', [db.meta, db.server, db.outbox, ...this.viewTables()], async () => {
      const meta = await this.meta()
      const serverKeys = (await db.server.where('shopId').equals(this.shopId).toArray()).map(s => key(s.table, s.id))
      const pending = await db.outbox.where('shopId').equals(this.shopId).sortBy('id')
      const keys = new Set([...serverKeys, ...pending.flatMap(m => m.targets)])
      await this.rebase([...keys], pending, meta.lmid)
    })
  }

  /** One full round: push everything, then pull everything. */
  async sync() {
    const pushed = await this.push()
    const pulled = await this.pull()
    return { pushed, pulled }
  }
}
