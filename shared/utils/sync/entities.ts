// Every record a person makes on a device (customers, amps, jobs, parts, labour, notes, bench
// results, procedure checks and runs): the rules for each one's fields. Its mutations are built
// from these in protocol.ts.
import { z } from 'zod'
import { JOB_PRIORITIES, JOB_STATES } from '../jobs/states'
import { MAX_REPEAT } from '../procedures/run'
import { BENCH_TOOL_IDS } from '../bench/tool-ids'
import { id } from '../schemas/records'
import { ENTITY_DEFAULTS, type EntityTable } from './entity-names'

// The names, defaults and grouping of the records are plain data in entity-names.ts (the device's
// sync engine loads them without any schema); the field rules are here.
export * from './entity-names'

const text = (max: number) => z.string().trim().max(max, { message: `at most ${max} characters` })
const cents = z.number().int({ message: 'must be whole cents' }).min(0).max(100_000_000)
const sha256 = z.string().regex(/^[0-9a-f]{64}$/, { message: 'must be a photo hash' })
const procedureId = z.string().min(1).max(64)
const at = z.iso.datetime({ offset: true, message: 'must be a date and time' })
export const RUN_STATUSES = ['running', 'done', 'stopped'] as const
const stepKey = z.string().min(1).max(80)
const stepReading = z.object({ value: z.number().finite().optional(), measurementId: id.optional(), at })
export const NOTE_VISIBILITY = ['internal', 'customer'] as const
export const SET_STATUSES = ['in-stock', 'fitted'] as const
export const SET_SIZES = [2, 4] as const
const isoDay = z.iso.date({ message: 'use a date like 2026-12-08' })
// A Tubes library entry: a built-in id ("6l6gc") or a shop entry's id.
const tubeType = z.string().trim().min(1, { message: 'pick a tube type' }).max(64)
const day = z.iso.date({ message: 'use a date like 2026-12-08' })
const position = z.string().trim().min(1, { message: 'name the socket' }).max(16)
const rigTube = z.object({ position, type: z.string().trim().min(1, { message: 'name the tube type' }).max(40) })
const ohms = z.number().positive({ message: 'must be more than 0 ohms' }).max(1000)
const rigReading = z.object({
  on: day,
  position,
  mA: z.number().positive({ message: 'must be more than 0 mA' }).max(1000),
  plateVolts: z.number().positive({ message: 'must be more than 0 V' }).max(2000).nullable(),
})

const FIELD_RULES = {
  customers: () => z.object({
    name: text(120).min(1, { message: 'enter a name' }),
    email: z.union([z.literal(''), z.email({ message: 'enter a valid e-mail address' })]),
    phone: text(40),
    notes: text(2000),
    playerUserId: id.nullable(),
  }),
  amps: () => z.object({
    customerId: id,
    description: text(200).min(1, { message: 'describe the amp' }),
    serial: text(80),
    tubeComplement: text(120),
    powerTubeCount: z.number().int().min(0).max(16),
    biasMode: z.enum(['fixed', 'cathode']),
    rectifier: text(60),
    notes: text(2000),
    rigId: id.nullable(),
  }),
  jobs: () => z.object({
    customerId: id,
    ampId: id,
    complaint: text(4000).min(1, { message: 'say what the customer reports' }),
    accessories: text(500),
    photos: z.array(sha256).max(20),
    promisedFor: z.union([z.literal(''), z.iso.date({ message: 'use a date like 2026-12-08' })]),
    assignedTo: id.nullable(),
    priority: z.enum(JOB_PRIORITIES),
    status: z.enum(JOB_STATES),
  }),
  jobParts: () => z.object({
    jobId: id,
    description: text(200).min(1, { message: 'describe the part' }),
    quantity: z.number().positive().max(10_000),
    unitCostCents: cents,
    unitPriceCents: cents,
  }),
  jobLabour: () => z.object({
    jobId: id,
    description: text(200),
    minutes: z.number().int().positive().max(100_000),
    rateCents: cents,
    techId: id.nullable(),
  }),
  // Shop tube stock: tubes bought together (cost per tube), each tube's reading at a stated test
  // point (SI: volts, amps, siemens), and the matched sets made from them.
  tubeLots: () => z.object({
    tubeType,
    maker: text(120),
    receivedOn: z.union([z.literal(''), isoDay]),
    costCents: cents,
    notes: text(2000),
  }),
  stockTubes: () => z.object({
    lotId: id,
    label: text(20).min(1, { message: 'give the tube a label, like L3-07' }),
    plateVolts: z.number({ message: 'enter the plate voltage' }).finite().positive({ message: 'the plate voltage must be above zero' }).max(2000, { message: 'at most 2000 V' }),
    gridVolts: z.number({ message: 'enter the grid bias' }).finite().min(-500, { message: 'at least -500 V' }).max(0, { message: 'the grid bias is zero or negative' }),
    amps: z.number({ message: 'enter the current' }).finite().positive({ message: 'the current must be above zero' }).max(1, { message: 'at most 1 A' }),
    transconductance: z.number().finite().positive({ message: 'the transconductance must be above zero' }).max(1).nullable(),
    testedOn: isoDay,
    testedBy: text(120),
    setId: id.nullable(),
  }),
  matchedSets: () => z.object({
    tubeType,
    label: text(20).min(1, { message: 'give the set a label, like S-12' }),
    tubeIds: z.array(id).min(2).max(4),
    size: z.union([z.literal(2), z.literal(4)], { message: 'a set is a pair or a quad' }),
    spreadFraction: z.number().finite().min(0).max(10),
    sorterResultId: id.nullable(),
    status: z.enum(SET_STATUSES),
    fittedJobId: id.nullable(),
    fittedAt: z.union([z.literal(''), at]),
    // The job part's price; null: the tubes' cost from their lots.
    priceCents: cents.nullable(),
  }),
  // Note text is kept as typed (not trimmed): it is the person's own writing.
  notes: () => z.object({
    jobId: id.nullable(),
    title: z.string().max(200, { message: 'at most 200 characters' }),
    body: z.string().max(20_000, { message: 'at most 20,000 characters' }),
    visibility: z.enum(NOTE_VISIBILITY),
  }),
  // A saved bench result; the server recomputes it from its inputs before taking it.
  measurements: () => z.object({
    tool: z.enum(BENCH_TOOL_IDS),
    inputs: z.record(z.string(), z.unknown()),
    outputs: z.record(z.string(), z.unknown()),
    engineVersion: z.string().max(20),
    label: z.string().max(200).nullable(),
    jobId: id.nullable(),
    // A player's rig: their own, or one shared with this shop (checked by the server).
    rigId: id.nullable(),
  }),
  // Insert-only: who ticked which hazards, when, for which run.
  procedureGates: () => z.object({
    runId: id,
    procedureId,
    jobId: id.nullable(),
    items: z.array(z.string().min(1).max(64)).min(1).max(30),
    acknowledgedAt: at,
  }),
  procedureRuns: () => z.object({
    procedureId,
    gateId: id,
    variant: z.string().max(40),
    jobId: id.nullable(),
    tubeCount: z.number().int().min(1).max(MAX_REPEAT),
    capCount: z.number().int().min(1).max(MAX_REPEAT),
    status: z.enum(RUN_STATUSES),
    stepIndex: z.number().int().min(0).max(500),
    readings: z.record(stepKey, stepReading).refine(r => Object.keys(r).length <= 500, { message: 'too many readings' }),
    warnings: z.array(z.object({ step: stepKey, text: z.string().max(500), value: z.number().finite().optional(), at })).max(200),
    endedAt: z.union([z.literal(''), at]),
    endReason: text(500),
  }),
  // A player's own amp and its history; kept in the player's personal space.
  rigs: () => z.object({
    description: text(200).min(1, { message: 'describe the amp' }),
    serial: text(80),
    tubes: z.array(rigTube).max(32),
    biasMode: z.enum(['fixed', 'cathode']),
    speakerLoadOhms: ohms.nullable(),
    outputTapOhms: ohms.nullable(),
    retubeHours: z.number().positive({ message: 'must be more than 0 hours' }).max(100_000).nullable(),
    retubeMonths: z.number().positive({ message: 'must be more than 0 months' }).max(600).nullable(),
    notes: text(2000),
  }),
  rigTubeSets: () => z.object({
    rigId: id,
    fittedOn: day,
    fittedBy: text(120),
    tubes: z.array(rigTube).max(32),
    readings: z.array(rigReading).max(2000),
    spare: z.boolean(),
    retiredOn: z.union([z.literal(''), day]),
  }),
  rigGigs: () => z.object({
    rigId: id,
    playedOn: day,
    hours: z.number().positive({ message: 'must be more than 0 hours' }).max(24, { message: 'at most 24 hours in a day' }),
    note: text(200),
  }),
  rigShares: () => z.object({
    rigId: id,
    sharedShopId: id,
  }),
  // Kept in the shop: retube thresholds the shop suggests for a rig shared with it. The player's
  // own thresholds stay theirs until they adopt one.
  rigSuggestions: () => z.object({
    rigId: id,
    retubeHours: z.number().positive({ message: 'must be more than 0 hours' }).max(100_000).nullable(),
    retubeMonths: z.number().positive({ message: 'must be more than 0 months' }).max(600).nullable(),
    note: text(200),
    suggestedBy: text(120),
  }),
} as const satisfies Record<EntityTable, () => z.ZodObject>

/**
 * Each record's field rules, built the first time they are read: a screen that only shows
 * records builds none, and one that checks a job builds the job's alone.
 */
export const ENTITY_FIELDS = builtOnFirstRead(FIELD_RULES)

function builtOnFirstRead<T extends Record<string, () => unknown>>(builders: T): { readonly [K in keyof T]: ReturnType<T[K]> } {
  const built = {} as { [K in keyof T]: ReturnType<T[K]> }
  for (const k of Object.keys(builders) as (keyof T & string)[]) {
    Object.defineProperty(built, k, {
      enumerable: true,
      configurable: true,
      get() {
        const value = builders[k]!() as ReturnType<T[typeof k]>
        Object.defineProperty(built, k, { value, enumerable: true })
        return value
      },
    })
  }
  return built
}

export type EntityFields<T extends EntityTable> = z.infer<(typeof ENTITY_FIELDS)[T]>

/** A create's full field set (defaults filled in), or the zod error naming what is missing. */
export function parseEntityCreate<T extends EntityTable>(table: T, args: { id: string } & Record<string, unknown>) {
  const { id: _id, ...rest } = args
  return ENTITY_FIELDS[table].safeParse({ ...ENTITY_DEFAULTS[table], ...rest }) as z.ZodSafeParseResult<EntityFields<T>>
}

