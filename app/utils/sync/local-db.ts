// The on-device database: one per signed-in user. Plain Dexie, no Vue, so tests run it in node.
import Dexie, { type Table } from 'dexie'
import type { MutationName, SyncedTable } from '#shared/utils/sync/protocol'
import type { EntityFields, EntityTable } from '#shared/utils/sync/entities'
import type { JobState } from '#shared/utils/jobs/states'
import { STORAGE_KEYS } from '~/utils/storage-keys'

export const LOCAL_DB_PREFIX = STORAGE_KEYS.localDbPrefix
export const localDbName = (userId: string) => `${LOCAL_DB_PREFIX}${userId}`

/** Per shop: this device's client id and mutation counter, and the pull cursor. */
export interface MetaRow {
  shopId: string
  clientId: string
  nextId: number
  cookie: string | null
  lmid: number
  lastSyncedAt: string | null
}

export interface OutboxRow {
  shopId: string
  id: number
  uuid: string
  name: MutationName
  args: Record<string, unknown>
  baseVersion?: number
  /** `table:id` of every record it changes, for rebasing. */
  targets: string[]
  createdAt: string
  /**
   * The server answered it (applied, conflict or rejected). It stays here, still replayed on the
   * view, until a pull brings the rows it changed; until then the server copy on this device is stale.
   */
  sent?: boolean
}

export interface ServerRow {
  table: SyncedTable
  id: string
  shopId: string
  version: number
  deleted: boolean
  data: Record<string, unknown> | null
}

interface ViewBase {
  id: string
  shopId: string
  /** Server version this view is based on (0: never reached the server). */
  version: number
  deleted: boolean
  /** Changes on this device not yet confirmed by the server. */
  pending: number
}

export interface ConflictRow extends ViewBase {
  tableName: SyncedTable
  rowId: string
  field: string
  serverValue: unknown
  clientValue: unknown
  serverAuthor: string | null
  clientAuthor: string
  serverChangedAt: string | null
  clientChangedAt: string
  status: 'open' | 'resolved'
  note: string | null
}

/** A synced record (customer, amp, job, part, labour, note, bench result, procedure check or run) as this device sees it. */
export type EntityRow<T extends EntityTable> = ViewBase & EntityFields<T> & {
  createdBy: string
  updatedBy: string | null
  createdAt: string
  updatedAt: string
}

export type NoteRow = EntityRow<'notes'>
export type MeasurementRow = EntityRow<'measurements'>

export interface JobEventRow extends ViewBase {
  jobId: string
  from: JobState | null
  to: JobState
  by: string
  at: string
}

export interface InvoiceRow extends ViewBase {
  jobId: string
  number: number
  kind: 'estimate' | 'invoice'
  state: 'draft' | 'sent' | 'paid' | 'void'
  lines: { kind: 'part' | 'labour', description: string, quantity: number, unitCents: number, totalCents: number }[]
  partsCents: number
  labourCents: number
  subtotalCents: number
  taxRateBasisPoints: number
  taxCents: number
  totalCents: number
  currency: string
  issuedAt: string | null
  paidAt: string | null
  paidWith: 'online' | 'cash' | 'card' | null
}

export interface RejectionRow {
  seq?: number
  shopId: string
  uuid: string
  name: MutationName
  args: Record<string, unknown>
  reason: string
  at: string
}

export interface BlobRow {
  sha256: string
  shopId: string
  type: string
  size: number
  blob: Blob
  /** 'refused': the server will never take it (wrong type, too large); kept so nothing vanishes. */
  status: 'pending' | 'uploaded' | 'refused'
  reason?: string
  createdAt: string
}

/** The on-device schema: each table's primary key, then its indexes (Dexie's notation). */
export const LOCAL_DB_SCHEMA = {
  meta: 'shopId',
  outbox: '[shopId+id], shopId, uuid, *targets',
  server: '[table+id], shopId',
  notes: 'id, shopId, updatedAt, jobId',
  measurements: 'id, shopId, createdAt, jobId, rigId',
  conflicts: 'id, shopId, rowId, status',
  rejections: '++seq, shopId, uuid',
  blobs: 'sha256, shopId, status',
  // Jobs and what hangs off them.
  customers: 'id, shopId, name, email, playerUserId',
  amps: 'id, shopId, customerId, serial',
  jobs: 'id, shopId, customerId, ampId, status, assignedTo, updatedAt',
  jobParts: 'id, shopId, jobId',
  jobLabour: 'id, shopId, jobId',
  jobEvents: 'id, shopId, jobId',
  invoices: 'id, shopId, jobId',
  // Guided procedures: the acknowledged safety check and the run it opens.
  procedureGates: 'id, shopId, runId, jobId',
  procedureRuns: 'id, shopId, jobId, status, updatedAt',
  // Shop tube stock: lots, their tubes' readings, matched sets.
  tubeLots: 'id, shopId, tubeType',
  stockTubes: 'id, shopId, lotId, setId',
  matchedSets: 'id, shopId, status, fittedJobId',
  // A player's rigs (kept in their personal space).
  rigs: 'id, shopId',
  rigTubeSets: 'id, shopId, rigId',
  rigGigs: 'id, shopId, rigId',
  rigShares: 'id, shopId, rigId',
  // Retube thresholds a shop suggests for a rig shared with it (kept per shop).
  rigSuggestions: 'id, shopId, rigId',
}
/** Raise with every change to the schema above (6: the retube suggestions). */
export const LOCAL_DB_VERSION = 6

export class LocalDb extends Dexie {
  meta!: Table<MetaRow, string>
  outbox!: Table<OutboxRow, [string, number]>
  server!: Table<ServerRow, [string, string]>
  notes!: Table<NoteRow, string>
  measurements!: Table<MeasurementRow, string>
  conflicts!: Table<ConflictRow, string>
  rejections!: Table<RejectionRow, number>
  blobs!: Table<BlobRow, string>
  customers!: Table<EntityRow<'customers'>, string>
  amps!: Table<EntityRow<'amps'>, string>
  jobs!: Table<EntityRow<'jobs'>, string>
  jobParts!: Table<EntityRow<'jobParts'>, string>
  jobLabour!: Table<EntityRow<'jobLabour'>, string>
  tubeLots!: Table<EntityRow<'tubeLots'>, string>
  stockTubes!: Table<EntityRow<'stockTubes'>, string>
  matchedSets!: Table<EntityRow<'matchedSets'>, string>
  jobEvents!: Table<JobEventRow, string>
  invoices!: Table<InvoiceRow, string>
  procedureGates!: Table<EntityRow<'procedureGates'>, string>
  procedureRuns!: Table<EntityRow<'procedureRuns'>, string>
  rigs!: Table<EntityRow<'rigs'>, string>
  rigTubeSets!: Table<EntityRow<'rigTubeSets'>, string>
  rigGigs!: Table<EntityRow<'rigGigs'>, string>
  rigShares!: Table<EntityRow<'rigShares'>, string>
  rigSuggestions!: Table<EntityRow<'rigSuggestions'>, string>

  constructor(name: string) {
    super(name)
    // One declaration of the whole schema: no version has an upgrade function, so Dexie brings a
    // database made by an earlier version (1: the outbox and notes; 2: jobs; 3: procedures; 4: tube
    // stock; 5: rigs) up to this one by adding what it lacks. Declaring each version again cost the
    // first screen tens of milliseconds of schema parsing on a phone.
    this.version(LOCAL_DB_VERSION).stores(LOCAL_DB_SCHEMA)
  }
}

export const VIEW_TABLES = ['notes', 'measurements', 'conflicts', 'customers', 'amps', 'jobs', 'jobParts', 'jobLabour', 'tubeLots', 'stockTubes', 'matchedSets', 'jobEvents', 'invoices', 'procedureGates', 'procedureRuns', 'rigs', 'rigTubeSets', 'rigGigs', 'rigShares', 'rigSuggestions'] as const
