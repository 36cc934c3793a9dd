// One shape per synced record, taken from the Drizzle schema (type-only: no server code reaches
// the client). A record as the device holds it is the table's row as JSON carries it, without the
// server's bookkeeping (field stamps, deletion time), plus what the device adds.
import type { amps, customers, invoices, jobLabour, jobParts, jobs, matchedSets, measurements, notes, procedureGates, procedureRuns, rigGigs, rigShares, rigSuggestions, rigs, rigTubeSets, stockTubes, tubeLots } from '../../server/db/schema'

/** A column as JSON brings it: dates arrive as ISO strings. */
type Wire<R> = { [K in keyof R]: R[K] extends Date ? string : R[K] extends Date | null ? string | null : R[K] }

/** What the device keeps beside a synced row. */
export interface DeviceState {
  /** The row is deleted (kept so a restore and a late change still find it). */
  deleted: boolean
  /** Changes on this device not yet confirmed by the server (0: none). */
  pending: number
}

export type DeviceRecord<R> = Omit<Wire<R>, 'fieldStamps' | 'deletedAt'> & DeviceState

export type CustomerRecord = DeviceRecord<typeof customers.$inferSelect>
export type AmpRecord = DeviceRecord<typeof amps.$inferSelect>
export type JobRecord = DeviceRecord<typeof jobs.$inferSelect>
export type JobPartRecord = DeviceRecord<typeof jobParts.$inferSelect>
export type JobLabourRecord = DeviceRecord<typeof jobLabour.$inferSelect>
export type TubeLotRecord = DeviceRecord<typeof tubeLots.$inferSelect>
export type StockTubeRecord = DeviceRecord<typeof stockTubes.$inferSelect>
export type MatchedSetRecord = DeviceRecord<typeof matchedSets.$inferSelect>
export type NoteRecord = DeviceRecord<typeof notes.$inferSelect>
export type MeasurementRecord = DeviceRecord<typeof measurements.$inferSelect>
export type ProcedureGateRecord = DeviceRecord<typeof procedureGates.$inferSelect>
export type ProcedureRunRecord = DeviceRecord<typeof procedureRuns.$inferSelect>
export type RigRecord = DeviceRecord<typeof rigs.$inferSelect>
export type RigTubeSetRecord = DeviceRecord<typeof rigTubeSets.$inferSelect>
export type RigGigRecord = DeviceRecord<typeof rigGigs.$inferSelect>
export type RigShareRecord = DeviceRecord<typeof rigShares.$inferSelect>
export type RigSuggestionRecord = DeviceRecord<typeof rigSuggestions.$inferSelect>
/** Written by the server only; the device gets it without its timestamps. */
export type InvoiceRecord = DeviceRecord<Omit<typeof invoices.$inferSelect, 'createdAt' | 'updatedAt'>>

/** The field-versioned records (created, edited field by field, deleted and restored), by table. */
export interface EntityRecords {
  customers: CustomerRecord
  amps: AmpRecord
  jobs: JobRecord
  jobParts: JobPartRecord
  jobLabour: JobLabourRecord
  tubeLots: TubeLotRecord
  stockTubes: StockTubeRecord
  matchedSets: MatchedSetRecord
  notes: NoteRecord
  measurements: MeasurementRecord
  procedureGates: ProcedureGateRecord
  procedureRuns: ProcedureRunRecord
  rigs: RigRecord
  rigTubeSets: RigTubeSetRecord
  rigGigs: RigGigRecord
  rigShares: RigShareRecord
  rigSuggestions: RigSuggestionRecord
}
