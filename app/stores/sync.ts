import { defineStore } from 'pinia'
import type { MutationArgs, MutationName } from '#shared/utils/sync/protocol'
import { ENTITY_PREFIX, ENTITY_TABLES, entityOf, isPersonalTable, type EntityTable } from '#shared/utils/sync/entity-names'
import { LocalDb, localDbName, type ConflictRow, type MetaRow, type OutboxRow, type RejectionRow } from '~/utils/sync/local-db'
import { SyncEngine, SyncHttpError, type Transport } from '~/utils/sync/engine'
import { syncStateOf, type SyncState } from '~/utils/sync/status'
import type { ConflictChoice } from '~/utils/sync/conflict-view'
import { STORAGE_KEYS } from '~/utils/storage-keys'
import { backoffDelay } from '~/utils/sync/backoff'
import { readUnsentHint, type UnsentHint } from '~/utils/sync/unsent'

export { readUnsentHint, type UnsentHint } from '~/utils/sync/unsent'

export const SYNC_DEBOUNCE_MS = 800
export const SYNC_INTERVAL_MS = 45_000

interface DeviceStatus { unsent: OutboxRow[], rejected: RejectionRow[], open: ConflictRow[], meta: MetaRow | undefined }
const NO_STATUS: DeviceStatus = { unsent: [], rejected: [], open: [], meta: undefined }

const isQuotaError = (e: unknown) => {
  const err = e as { name?: string, inner?: { name?: string } } | null
  return err?.name === 'QuotaExceededError' || err?.inner?.name === 'QuotaExceededError'
}

// Answers every HTTP status as data; only a request that got no answer throws.
const transport: Transport = async (path, body) => {
  const res = await $fetch.raw(path, { method: 'POST', body: body as Record<string, unknown>, credentials: 'include', ignoreResponseError: true, retry: 0, timeout: 30_000 })
  return { status: res.status, body: res._data ?? null }
}

/**
 * The on-device database of the signed-in user, one engine per shop, and when to sync. Beside the
 * active shop's engine runs the engine of the person's own space (their rigs): both sync together,
 * and a change goes to the one its record lives in.
 */
export const useSyncStore = defineStore('sync', () => {
  const session = useSessionStore()
  const db = shallowRef<LocalDb | null>(null)
  const engine = shallowRef<SyncEngine | null>(null)
  const shopId = computed(() => engine.value?.shopId ?? null)
  const personal = shallowRef<SyncEngine | null>(null)
  const personalId = computed(() => personal.value?.shopId ?? null)
  const engines = new Map<string, { engine: SyncEngine, ready: Promise<void> }>()

  const sending = ref(false)
  const offline = ref(false)
  const error = ref('')
  const blocked = ref<'update' | null>(null)
  const storageFull = ref(false)
  const persisted = ref<boolean | null>(null)
  let persistAsked = false

  const deps = () => [db.value, shopId.value, personalId.value]
  // The active shop and the person's own space, together.
  const spaces = () => [shopId.value, personalId.value].filter((s): s is string => !!s)
  const forShop = <T>(q: (d: LocalDb, shops: string[]) => Promise<T>, empty: T) => () => (db.value && spaces().length ? q(db.value, spaces()) : empty)
  // What the sync chip and screen show, read in one transaction: changes the server has not
  // answered yet (answered ones wait for the next pull, see engine.ts), refusals, open conflicts
  // and the active space's meta. One query instead of one per figure: each costs a transaction
  // and a re-run on every change, which a slow phone feels while the first sync fills the device.
  const status = useLiveQuery(forShop((d, s) => d.transaction('r', [d.outbox, d.rejections, d.conflicts, d.meta], async () => {
    const [unsent, rejected, open, m] = await Promise.all([
      d.outbox.where('shopId').anyOf(s).filter(m => !m.sent).toArray(),
      d.rejections.where('shopId').anyOf(s).reverse().sortBy('seq'),
      d.conflicts.where('shopId').anyOf(s).filter(c => c.status === 'open').toArray(),
      d.meta.get(s[0]!),
    ])
    return { unsent, rejected, open, meta: m }
  }), NO_STATUS), deps, NO_STATUS)
  const pending = computed(() => status.value.unsent.length)
  const pendingList = computed(() => [...status.value.unsent].sort((a, b) => a.createdAt.localeCompare(b.createdAt) || a.id - b.id).slice(0, 100))
  const rejections = computed(() => status.value.rejected)
  const conflictList = computed(() => status.value.open)
  const meta = computed(() => status.value.meta)

  const conflicts = computed(() => conflictList.value.length)
  const conflictRowIds = computed(() => new Set(conflictList.value.map(c => c.rowId)))
  const lastSyncedAt = computed(() => meta.value?.lastSyncedAt ?? null)
  const state = computed<SyncState>(() => syncStateOf({ pending: pending.value, conflicts: conflicts.value, sending: sending.value, lastSyncedAt: lastSyncedAt.value }))

  let timer: ReturnType<typeof setTimeout> | undefined
  let retryAt = 0
  let attempt = 0
  let running = false
  let again = false

  function schedule(ms: number) {
    if (!import.meta.client) return
    clearTimeout(timer)
    timer = setTimeout(() => void runSync(), ms)
  }
  /** Sync now unless a backoff is running (a write never bypasses it). */
  function kick(ms = 0) {
    if (Date.now() < retryAt) return
    schedule(ms)
  }

  function backOff() {
    attempt++
    const ms = backoffDelay(attempt)
    retryAt = Date.now() + ms
    schedule(ms)
  }

  async function exclusive(userId: string, fn: () => Promise<void>) {
    const locks = typeof navigator !== 'undefined' ? navigator.locks : undefined
    if (!locks?.request) return fn()
    await locks.request(`${STORAGE_KEYS.syncLockPrefix}${userId}`, { ifAvailable: true }, async (lock) => {
      // Another tab of this user is syncing; it writes to the same database, so this tab sees the result.
      if (lock) await fn()
    })
  }

  async function runSync() {
    const current = [engines.get(shopId.value ?? ''), engines.get(personalId.value ?? '')].filter(e => !!e)
    if (!current.length || blocked.value) return
    if (running) {
      again = true
      return
    }
    running = true
    try {
      for (const c of current) await c.ready
      await exclusive(current[0]!.engine.userId, async () => {
        for (const c of current) {
          sending.value = (await c.engine.pendingCount()) > 0
          await c.engine.sync()
        }
      })
      attempt = 0
      retryAt = 0
      offline.value = false
      error.value = ''
    }
    catch (e) {
      await onSyncError(e)
    }
    finally {
      running = false
      sending.value = false
      if (again) {
        again = false
        kick(SYNC_DEBOUNCE_MS)
      }
    }
  }

  async function onSyncError(e: unknown) {
    if (isQuotaError(e)) {
      storageFull.value = true
      return backOff()
    }
    // No answer at all. navigator.onLine is not trusted either way: only a failed request says offline.
    if (!(e instanceof SyncHttpError)) {
      offline.value = true
      return backOff()
    }
    offline.value = false
    if (e.status === 426) {
      blocked.value = 'update'
      return
    }
    if (e.status === 401) {
      // Ask the server who we are: only a real 401 there signs out (the outbox stays in this user's database).
      await session.refresh()
      return backOff()
    }
    error.value = e.status === 503 ? '' : e.message
    backOff()
  }

  function rememberUnsent(user: { id: string, name: string, email: string }, count: number) {
    if (count > 0) localStorage.setItem(STORAGE_KEYS.unsent, JSON.stringify({ userId: user.id, name: user.name, email: user.email, count } satisfies UnsentHint))
  }

  function entryFor(userId: string, shop: string) {
    let entry = engines.get(shop)
    if (!entry) {
      const e = markRaw(new SyncEngine({ db: db.value!, userId, shopId: shop, transport }))
      entry = { engine: e, ready: e.rebuild().catch((err) => { console.error('rebuilding the on-device view failed', err) }) }
      engines.set(shop, entry)
    }
    return entry
  }

  function open(userId: string | null, shop: string | null, own: string | null = null) {
    if (db.value && db.value.name !== (userId ? localDbName(userId) : '')) {
      engine.value = null
      personal.value = null
      engines.clear()
      db.value.close()
      db.value = null
    }
    if (!userId) return
    if (readUnsentHint()?.userId === userId) localStorage.removeItem(STORAGE_KEYS.unsent)
    db.value ??= markRaw(new LocalDb(localDbName(userId)))
    personal.value = own ? entryFor(userId, own).engine : null
    engine.value = shop ? entryFor(userId, shop).engine : null
    if (!shop && !own) return
    attempt = 0
    retryAt = 0
    kick()
  }

  /** Save one change on this device (durable before it resolves), then sync soon. */
  /** The engine a change belongs to: the person's own space for rig records (and their conflicts), else the active shop's. */
  async function engineFor(name: MutationName, args: unknown) {
    const table = name === 'conflict.resolve'
      ? (await db.value?.conflicts.get(String((args as { id: string }).id)))?.shopId === personalId.value && personalId.value ? 'rigs' : ''
      : entityOf(name)?.table ?? ''
    if (isPersonalTable(table)) {
      if (!personal.value) throw new Error('Your rigs are not ready on this device yet: connect once so the app can set up your own space.')
      return personal.value
    }
    if (!engine.value) throw new Error('Choose a shop first: notes and results are kept per shop.')
    return engine.value
  }

  async function mutate<N extends MutationName>(name: N, args: MutationArgs<N>, baseVersion?: number) {
    const e = await engineFor(name, args)
    try {
      // Plain JSON: reactive proxies cannot be stored, and the server receives JSON anyway.
      const row = await e.mutate(name, JSON.parse(JSON.stringify(args)) as MutationArgs<N>, baseVersion)
      storageFull.value = false
      void askPersistence()
      kick(SYNC_DEBOUNCE_MS)
      return row
    }
    catch (err) {
      if (isQuotaError(err)) {
        storageFull.value = true
        throw new Error('This device is out of storage space, so the change was not saved. Free some space and try again.', { cause: err })
      }
      throw err
    }
  }

  async function askPersistence() {
    if (persistAsked || typeof navigator === 'undefined' || !navigator.storage?.persist) return
    persistAsked = true
    persisted.value = (await navigator.storage.persisted()) || (await navigator.storage.persist())
  }

  /** A person's decision: the chosen or merged value becomes the record's. */
  async function resolveConflict(id: string, choice: ConflictChoice) {
    const c = await db.value?.conflicts.get(id)
    if (!c) throw new Error('That conflict is not on this device.')
    await mutate('conflict.resolve', { id, value: choice.value })
    if (!choice.thenDelete) return
    if (c.tableName === 'notes') {
      const note = await db.value?.notes.get(c.rowId)
      await mutate('note.delete', { id: c.rowId }, note?.version)
    }
    else if ((ENTITY_TABLES as readonly string[]).includes(c.tableName)) {
      const row = await db.value?.table(c.tableName).get(c.rowId) as { version?: number } | undefined
      await mutate(`${ENTITY_PREFIX[c.tableName as EntityTable]}.delete` as MutationName, { id: c.rowId } as never, row?.version)
    }
  }

  async function dismissRejection(seq: number) {
    await db.value?.rejections.delete(seq)
  }

  let started = false
  /** Called once by the client plugin: follow the session, and sync on the usual occasions. */
  function start() {
    if (started || !import.meta.client) return
    started = true
    watch(() => session.user, (user, before) => {
      if (before && before.id !== user?.id && engine.value?.userId === before.id) rememberUnsent(before, pending.value)
    })
    watch(() => [session.user?.id ?? null, session.activeShop?.id ?? null, session.me?.personalSpaceId ?? null] as const, ([u, s, p]) => open(u, s, p), { immediate: true })
    window.addEventListener('online', () => {
      offline.value = false
      attempt = 0
      retryAt = 0
      kick()
    })
    window.addEventListener('offline', () => {
      offline.value = true
    })
    document.addEventListener('visibilitychange', () => {
      if (document.visibilityState === 'visible') kick()
    })
    setInterval(() => {
      if (document.visibilityState === 'visible') kick()
    }, SYNC_INTERVAL_MS)
    void navigator.storage?.persisted?.().then((p) => {
      persisted.value = p
    })
  }

  return {
    db, engine, shopId, personal, personalId, state, pending, pendingList, rejections, conflictList, conflicts, conflictRowIds, lastSyncedAt,
    sending, offline, error, blocked, storageFull, persisted,
    start, mutate, resolveConflict, syncNow: () => {
      attempt = 0
      retryAt = 0
      schedule(0)
    }, dismissRejection,
  }
})
