// The records' names, defaults and grouping, as plain data: the device's sync engine and the
// screens that only name a record load this without the field rules (entities.ts, built with zod).
import type { EntityFields } from './entities'

/** Every kind of record a person makes on a device; entities.ts gives each its fields. */
export const ENTITY_TABLES = [
  'customers', 'amps', 'jobs', 'jobParts', 'jobLabour', 'tubeLots', 'stockTubes', 'matchedSets', 'notes',
  'measurements', 'procedureGates', 'procedureRuns', 'rigs', 'rigTubeSets', 'rigGigs', 'rigShares', 'rigSuggestions',
] as const
export type EntityTable = (typeof ENTITY_TABLES)[number]

export const ENTITY_PREFIX = {
  customers: 'customer',
  amps: 'amp',
  jobs: 'job',
  jobParts: 'jobPart',
  jobLabour: 'jobLabour',
  tubeLots: 'tubeLot',
  stockTubes: 'stockTube',
  matchedSets: 'matchedSet',
  notes: 'note',
  measurements: 'measurement',
  procedureGates: 'procedureGate',
  procedureRuns: 'procedureRun',
  rigs: 'rig',
  rigTubeSets: 'rigTubeSet',
  rigGigs: 'rigGig',
  rigShares: 'rigShare',
  rigSuggestions: 'rigSuggestion',
} as const satisfies Record<EntityTable, string>

/** What a person calls one record of each kind (sync screen, conflicts, "not found" answers). */
export const ENTITY_NOUNS: Record<EntityTable, string> = {
  customers: 'Customer', amps: 'Amp', jobs: 'Job', jobParts: 'Part', jobLabour: 'Labour',
  tubeLots: 'Tube lot', stockTubes: 'Stock tube', matchedSets: 'Matched set', notes: 'Note',
  measurements: 'Bench result', procedureGates: 'Safety check', procedureRuns: 'Procedure run',
  rigs: 'Rig', rigTubeSets: 'Tube set', rigGigs: 'Gig', rigShares: 'Rig share',
  rigSuggestions: 'Retube suggestion',
}

/** Fields a create may leave out, with their defaults. */
export const ENTITY_DEFAULTS: { [T in EntityTable]: Partial<EntityFields<T>> } = {
  customers: { email: '', phone: '', notes: '', playerUserId: null },
  amps: { serial: '', tubeComplement: '', powerTubeCount: 2, biasMode: 'fixed', rectifier: '', notes: '', rigId: null },
  jobs: { accessories: '', photos: [], promisedFor: '', assignedTo: null, priority: 'normal', status: 'checked-in' },
  jobParts: { unitCostCents: 0 },
  jobLabour: { description: '', techId: null },
  tubeLots: { maker: '', receivedOn: '', costCents: 0, notes: '' },
  stockTubes: { transconductance: null, testedBy: '', setId: null },
  matchedSets: { sorterResultId: null, status: 'in-stock', fittedJobId: null, fittedAt: '', priceCents: null },
  notes: { jobId: null, title: '', visibility: 'internal' },
  measurements: { label: null, jobId: null, rigId: null },
  procedureGates: { jobId: null },
  procedureRuns: { variant: '', jobId: null, tubeCount: 2, capCount: 3, status: 'running', stepIndex: 0, readings: {}, warnings: [], endedAt: '', endReason: '' },
  rigs: { serial: '', tubes: [], biasMode: 'fixed', speakerLoadOhms: null, outputTapOhms: null, retubeHours: null, retubeMonths: null, notes: '' },
  rigTubeSets: { fittedBy: '', tubes: [], readings: [], spare: false, retiredOn: '' },
  rigGigs: { note: '' },
  rigShares: {},
  rigSuggestions: { retubeHours: null, retubeMonths: null, note: '', suggestedBy: '' },
}

/** Fields set when the record is made and never by `.setFields` (a setFields naming one drops it). */
export const ENTITY_FIXED: Partial<Record<EntityTable, readonly string[]>> = {
  notes: ['jobId'],
  tubeLots: ['tubeType'],
  stockTubes: ['lotId'],
  // A set is the tubes it was matched from; to change them, delete it and match again.
  matchedSets: ['tubeType', 'tubeIds', 'size', 'spreadFraction', 'sorterResultId'],
  rigTubeSets: ['rigId'],
  rigGigs: ['rigId'],
}

/** Records that are made once and never edited: no `.setFields` mutation. */
// A rig share is made and revoked (deleted), never edited.
// A suggestion is replaced by a newer one, never edited.
export const INSERT_ONLY = ['measurements', 'rigShares', 'rigSuggestions'] as const satisfies readonly EntityTable[]

/** `job.setFields` -> { table: 'jobs', verb: 'setFields' }; undefined for non-entity mutations. */
export function entityOf(name: string): { table: EntityTable, verb: 'create' | 'setFields' | 'delete' | 'restore' } | undefined {
  const [prefix, verb] = name.split('.')
  const table = (Object.keys(ENTITY_PREFIX) as EntityTable[]).find(t => ENTITY_PREFIX[t] === prefix)
  if (!table || !verb || !['create', 'setFields', 'delete', 'restore'].includes(verb)) return undefined
  return { table, verb: verb as 'create' | 'setFields' | 'delete' | 'restore' }
}

/** Records kept in the person's own space (shops.kind = 'personal'), synced by the device's second engine. */
export const PERSONAL_TABLES = ['rigs', 'rigTubeSets', 'rigGigs', 'rigShares'] as const satisfies readonly EntityTable[]
export const isPersonalTable = (table: string) => (PERSONAL_TABLES as readonly string[]).includes(table)
