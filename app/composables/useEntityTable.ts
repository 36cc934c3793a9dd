import { defineStore } from 'pinia'
import { ENTITY_FIELDS, ENTITY_PREFIX, type EntityFields, type EntityTable } from '#shared/utils/sync/entities'
import type { Table } from 'dexie'
import type { MutationName } from '#shared/utils/sync/protocol'
import type { EntityRecords, InvoiceRecord } from '#shared/types/records'
import type { EntityRow, InvoiceRow } from '~/utils/sync/local-db'
import { fieldErrors, validateCreate, type FieldErrors } from '~/utils/jobs/check-in'

// The device's rows and the schema's records are one shape: this stops compiling if they drift.
type Same<A, B> = [A] extends [B] ? ([B] extends [A] ? true : false) : false
const ONE_SHAPE: { [T in EntityTable]: Same<EntityRow<T>, EntityRecords[T]> } = {
  customers: true, amps: true, jobs: true, jobParts: true, jobLabour: true, tubeLots: true, stockTubes: true, matchedSets: true, notes: true, measurements: true, procedureGates: true, procedureRuns: true,
  rigs: true, rigTubeSets: true, rigGigs: true, rigShares: true, rigSuggestions: true,
}
const INVOICE_SHAPE: Same<InvoiceRow, InvoiceRecord> = true
void ONE_SHAPE
void INVOICE_SHAPE

type Dated = { createdAt: string }
export const oldestFirst = (a: Dated, b: Dated) => (a.createdAt < b.createdAt ? -1 : a.createdAt > b.createdAt ? 1 : 0)
export const newestFirst = (a: Dated, b: Dated) => oldestFirst(b, a)

/** A create or edit the record schema refuses; `fields` holds the message for each field. */
export class EntityInvalidError extends Error {
  constructor(readonly fields: FieldErrors) {
    super(Object.values(fields)[0] ?? 'That is not valid.')
  }
}

export interface EntityTableOptions<T extends EntityTable> {
  /** How the record is named in "That amp is not on this device." */
  noun: string
  /** The order of `all` and `forJob` (default: as the device database gives them). */
  order?: (a: EntityRecords[T], b: EntityRecords[T]) => number
}

// Names are built from the table's prefix, so TypeScript sees only their common shape.
type AnyMutation = (name: MutationName, args: Record<string, unknown>, baseVersion?: number) => Promise<unknown>

/**
 * One synced record type of the active shop: its live rows from the device database, and the
 * create / edit / remove / restore changes that go through the outbox, checked with the same
 * record schema the server applies.
 */
export function useEntityTable<T extends EntityTable>(table: T, options: EntityTableOptions<T>) {
  type Row = EntityRecords[T]
  type Fields = Partial<EntityFields<T>>
  const sync = useSyncStore()
  const prefix = ENTITY_PREFIX[table]
  const mutate = sync.mutate as unknown as AnyMutation
  const { list, loaded } = useShopTable(table)
  const all = computed<Row[]>(() => {
    const rows = list.value as unknown as Row[]
    return options.order ? [...rows].sort(options.order) : rows
  })
  const byId = (id: string | null | undefined) => (id ? all.value.find(r => r.id === id) : undefined)
  const forJob = (jobId: string) => all.value.filter(r => (r as { jobId?: string | null }).jobId === jobId)

  const stored = (id: string) => (sync.db?.[table] as Table<Row, string> | undefined)?.get(id)

  // From the database, not the list: the list may not yet show a change made a moment ago.
  async function required(id: string): Promise<Row> {
    const row = await stored(id)
    if (!row) throw new Error(`That ${options.noun} is not on this device.`)
    return row
  }

  /** Checks the fields (defaults filled in) and queues the create; answers the new record's id. */
  async function create(fields: Fields, id: string = crypto.randomUUID()): Promise<string> {
    const v = validateCreate(table, fields)
    if (!v.ok) throw new EntityInvalidError(v.errors)
    await mutate(`${prefix}.create` as MutationName, { id, ...v.value })
    return id
  }

  /** Sends only the fields that changed, based on the version this device last saw; false if none did. */
  async function edit(id: string, fields: Fields): Promise<boolean> {
    const row = await required(id)
    const changed = changedFields(row as unknown as Fields, fields)
    if (!Object.keys(changed).length) return false
    const v = ENTITY_FIELDS[table].partial().safeParse(changed)
    if (!v.success) throw new EntityInvalidError(fieldErrors(v.error))
    await mutate(`${prefix}.setFields` as MutationName, { id, fields: v.data }, row.version)
    return true
  }

  async function remove(id: string) {
    await mutate(`${prefix}.delete` as MutationName, { id }, (await required(id)).version)
  }

  /** Brings a deleted record back (the device database keeps deleted rows). */
  async function restore(id: string) {
    await mutate(`${prefix}.restore` as MutationName, { id }, (await required(id)).version)
  }

  return { all, loaded, byId, forJob, required, create, edit, remove, restore }
}

export type EntityTableApi<T extends EntityTable> = ReturnType<typeof useEntityTable<T>>

/**
 * A Pinia setup store over one synced table: everything `useEntityTable` gives, plus what
 * `extend` adds (searches, moves, names the components already use).
 */
export function defineEntityStore<T extends EntityTable, X extends object = object>(
  table: T,
  options: EntityTableOptions<T> & { id?: string },
  extend?: (base: EntityTableApi<T>) => X,
) {
  return defineStore(options.id ?? table, () => {
    const base = useEntityTable(table, options)
    return { ...base, ...(extend?.(base) ?? ({} as X)) }
  })
}
