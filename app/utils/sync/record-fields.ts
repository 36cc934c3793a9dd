// How each synced record and field reads on screen: its name, and its values as the app shows them.
import { JOB_STATE_LABELS, type JobState } from '#shared/utils/jobs/states'
import { formatMoney } from '#shared/utils/jobs/money'
import { findProcedure } from '#shared/utils/procedures/index'
import { ENTITY_NOUNS } from '#shared/utils/sync/entity-names'

/** text: free text a person may merge; the rest are picked, never typed. */
export type FieldKind = 'text' | 'longtext' | 'enum' | 'money' | 'number' | 'minutes' | 'date' | 'person' | 'record' | 'other'

interface FieldInfo { label: string, kind: FieldKind, options?: Record<string, string> }

const PRIORITY_LABELS = { low: 'Low', normal: 'Normal', rush: 'Rush' }
const RUN_STATUS_LABELS = { running: 'Running', done: 'Done', stopped: 'Stopped' }
const SET_STATUS_LABELS = { 'in-stock': 'In stock', 'fitted': 'Fitted to a job' }

export const RECORD_NOUNS: Record<string, string> = ENTITY_NOUNS

const FIELDS: Record<string, Record<string, FieldInfo>> = {
  notes: {
    body: { label: 'text', kind: 'longtext' },
    title: { label: 'title', kind: 'text' },
    visibility: { label: 'who sees it', kind: 'enum', options: { internal: 'Shop only', customer: 'Shop and customer' } },
  },
  customers: {
    name: { label: 'name', kind: 'text' },
    email: { label: 'e-mail', kind: 'text' },
    phone: { label: 'phone', kind: 'text' },
    notes: { label: 'notes', kind: 'longtext' },
    playerUserId: { label: 'linked player', kind: 'person' },
  },
  amps: {
    customerId: { label: 'owner', kind: 'record' },
    description: { label: 'description', kind: 'text' },
    serial: { label: 'serial', kind: 'text' },
    tubeComplement: { label: 'tubes', kind: 'text' },
    powerTubeCount: { label: 'power tubes', kind: 'number' },
    biasMode: { label: 'bias', kind: 'enum', options: { fixed: 'Fixed bias', cathode: 'Cathode bias' } },
    rectifier: { label: 'rectifier', kind: 'text' },
    notes: { label: 'notes', kind: 'longtext' },
  },
  jobs: {
    customerId: { label: 'customer', kind: 'record' },
    ampId: { label: 'amp', kind: 'record' },
    complaint: { label: 'complaint', kind: 'longtext' },
    accessories: { label: 'accessories', kind: 'text' },
    photos: { label: 'photos', kind: 'other' },
    promisedFor: { label: 'promised for', kind: 'date' },
    assignedTo: { label: 'assigned tech', kind: 'person' },
    priority: { label: 'priority', kind: 'enum', options: PRIORITY_LABELS },
    status: { label: 'status', kind: 'enum', options: JOB_STATE_LABELS as Record<JobState, string> },
  },
  jobParts: {
    jobId: { label: 'job', kind: 'record' },
    description: { label: 'description', kind: 'text' },
    quantity: { label: 'quantity', kind: 'number' },
    unitCostCents: { label: 'unit cost', kind: 'money' },
    unitPriceCents: { label: 'unit price', kind: 'money' },
  },
  jobLabour: {
    jobId: { label: 'job', kind: 'record' },
    description: { label: 'description', kind: 'text' },
    minutes: { label: 'time', kind: 'minutes' },
    rateCents: { label: 'hourly rate', kind: 'money' },
    techId: { label: 'tech', kind: 'person' },
  },
  tubeLots: {
    maker: { label: 'maker and label', kind: 'text' },
    receivedOn: { label: 'received', kind: 'date' },
    costCents: { label: 'cost per tube', kind: 'money' },
    notes: { label: 'notes', kind: 'longtext' },
  },
  stockTubes: {
    label: { label: 'label', kind: 'text' },
    plateVolts: { label: 'plate volts at the test', kind: 'number' },
    gridVolts: { label: 'grid volts at the test', kind: 'number' },
    amps: { label: 'current (A)', kind: 'number' },
    transconductance: { label: 'transconductance (S)', kind: 'number' },
    testedOn: { label: 'tested on', kind: 'date' },
    testedBy: { label: 'tested by', kind: 'text' },
    setId: { label: 'matched set', kind: 'record' },
  },
  matchedSets: {
    label: { label: 'label', kind: 'text' },
    status: { label: 'status', kind: 'enum', options: SET_STATUS_LABELS },
    fittedJobId: { label: 'fitted to job', kind: 'record' },
    fittedAt: { label: 'fitted at', kind: 'other' },
    priceCents: { label: 'price', kind: 'money' },
  },
  procedureRuns: {
    status: { label: 'status', kind: 'enum', options: RUN_STATUS_LABELS },
    stepIndex: { label: 'current step', kind: 'number' },
    tubeCount: { label: 'tubes', kind: 'number' },
    capCount: { label: 'capacitors', kind: 'number' },
  },
  rigs: {
    description: { label: 'description', kind: 'text' },
    serial: { label: 'serial', kind: 'text' },
    tubes: { label: 'tubes', kind: 'other' },
    biasMode: { label: 'bias', kind: 'enum', options: { fixed: 'Fixed bias', cathode: 'Cathode bias' } },
    speakerLoadOhms: { label: 'speaker load (ohms)', kind: 'number' },
    outputTapOhms: { label: 'output tap (ohms)', kind: 'number' },
    retubeHours: { label: 'retube after (hours)', kind: 'number' },
    retubeMonths: { label: 'retube after (months)', kind: 'number' },
    notes: { label: 'notes', kind: 'longtext' },
  },
  rigTubeSets: {
    fittedOn: { label: 'fitted on', kind: 'date' },
    fittedBy: { label: 'fitted by', kind: 'text' },
    tubes: { label: 'tubes', kind: 'other' },
    readings: { label: 'readings', kind: 'other' },
    spare: { label: 'spare', kind: 'enum', options: { true: 'Spare set', false: 'Fitted' } },
    retiredOn: { label: 'retired on', kind: 'date' },
  },
  rigGigs: {
    playedOn: { label: 'played on', kind: 'date' },
    hours: { label: 'hours', kind: 'number' },
    note: { label: 'note', kind: 'text' },
  },
  rigSuggestions: {
    retubeHours: { label: 'retube after (hours)', kind: 'number' },
    retubeMonths: { label: 'retube after (months)', kind: 'number' },
    note: { label: 'note', kind: 'text' },
  },
}

export function fieldInfo(table: string, field: string): FieldInfo {
  return FIELDS[table]?.[field] ?? { label: field.replace(/([A-Z])/g, ' $1').toLowerCase(), kind: 'other' }
}

export interface ValueNames { currency?: string, person?: (id: string) => string | undefined, recordName?: (id: string) => string | undefined }

/** A value as the rest of the app shows it. */
export function formatFieldValue(table: string, field: string, value: unknown, names: ValueNames = {}): string {
  const info = fieldInfo(table, field)
  if (value === null || value === undefined || value === '') return info.kind === 'person' ? 'Nobody' : '(empty)'
  switch (info.kind) {
    case 'enum': return info.options?.[String(value)] ?? String(value)
    case 'money': return typeof value === 'number' ? formatMoney(value, names.currency) : String(value)
    case 'minutes': return typeof value === 'number' ? `${Math.floor(value / 60)} h ${value % 60} min` : String(value)
    case 'date': {
      const d = new Date(`${String(value)}T12:00:00`)
      return Number.isNaN(d.getTime()) ? String(value) : d.toLocaleDateString('en-GB', { weekday: 'short', day: 'numeric', month: 'short', year: 'numeric' })
    }
    case 'person': return names.person?.(String(value)) ?? 'another member'
    case 'record': return names.recordName?.(String(value)) ?? 'another record'
    case 'text': case 'longtext': case 'number': return String(value)
    default: return typeof value === 'string' ? value : JSON.stringify(value)
  }
}

const clip = (s: string, n = 40) => (s.length > n ? `${s.slice(0, n - 1)}…` : s)

/** A record's own name: "Part 'Output transformer'", "Job 'two-6L6 combo · Dana Whitlow'". */
export function recordTitle(table: string, row: Record<string, unknown> | undefined, related: { amp?: string, customer?: string } = {}): string {
  const noun = RECORD_NOUNS[table] ?? 'Record'
  if (!row) return `A ${noun.toLowerCase()}`
  let name = ''
  if (table === 'notes') name = String(row.title || '') || clip(String(row.body ?? ''))
  else if (table === 'customers') name = String(row.name ?? '')
  else if (table === 'amps') name = [row.description, row.serial].filter(Boolean).join(' · ')
  else if (table === 'jobs') name = [related.amp, related.customer].filter(Boolean).join(' · ')
  else if (table === 'jobParts' || table === 'jobLabour') name = String(row.description ?? '')
  else if (table === 'stockTubes' || table === 'matchedSets') name = String(row.label ?? '')
  else if (table === 'tubeLots') name = String(row.maker || row.tubeType || '')
  else if (table === 'procedureRuns' || table === 'procedureGates') name = findProcedure(String(row.procedureId))?.title ?? ''
  else if (table === 'rigs') name = String(row.description ?? '')
  else if (table === 'rigTubeSets') name = String(row.fittedOn ?? '')
  else if (table === 'rigGigs') name = String(row.playedOn ?? '')
  return name ? `${noun} '${clip(name, 60)}'` : noun
}
