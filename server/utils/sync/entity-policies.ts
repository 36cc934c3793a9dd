import { and, eq, isNull } from 'drizzle-orm'
import type { MySqlTableWithColumns } from 'drizzle-orm/mysql-core'
import { randomUUID } from 'node:crypto'
import type { EntityFields, EntityTable } from '#shared/utils/sync/entities'
import type { Role } from '#shared/utils/roles'
import { canTransition, JOB_STATE_LABELS, type JobState } from '#shared/utils/jobs/states'
import { evaluateRun, findProcedure, gateComplete, mayRun, validVariant, type ProcedureDefinition } from '#shared/utils/procedures/index'
import { parseToolInputs, verifySavedResult, type BenchToolId } from '#shared/utils/bench'
import { reject, type ApplyContext } from './context'
import { STOCK_POLICIES } from './stock-policies'

type Row = Record<string, unknown> & { id: string, status?: JobState }

/**
 * How the server takes one kind of record. Who may create, change and delete it is in
 * PERMISSIONS (`#shared/utils/permissions`), read by the apply functions.
 */
export interface EntityPolicy {
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- each entry is one of the entity tables
  table: MySqlTableWithColumns<any>
  /** The refusal when a role that may touch only its own records touches someone else's. */
  ownReason?: string
  /** The fields as stored, from the fields as sent (may refuse them). */
  normalise?: (fields: Record<string, unknown>) => Record<string, unknown>
  /** Refuse an edit outright, before conflicts are weighed (`fields` as sent, `row` as stored). */
  guard?: (ctx: ApplyContext, fields: Record<string, unknown>, row: Row) => void
  /** Refuse a record that points at something outside this shop. Reads only: see needsSavepoint. */
  check?: (ctx: ApplyContext, next: Record<string, unknown>, before?: Row) => Promise<void>
  /** Refuse a delete (a set fitted to a job); `row` as stored. */
  beforeDelete?: (ctx: ApplyContext, row: Row) => void | Promise<void>
  /** Rows the server writes alongside (the job timeline). */
  after?: (ctx: ApplyContext, next: Record<string, unknown>, before?: Row) => Promise<void>
  /**
   * Creates of this table that follow each other in one push may be inserted together: its
   * `check` reads no row of this table, so a row still waiting to be written cannot change it.
   */
  insertsTogether?: true
}

/**
 * Refuse a reference to a record that is not a live record of this shop (checked inside the
 * mutation's transaction). `mayBeNew`: the record may not exist yet (a gate names the run it opens),
 * but an id already used by another shop or by a deleted record is still refused. Over REST the
 * refusal is a 404, as for any record outside the caller's shop.
 */
export async function mustExist(ctx: ApplyContext, table: EntityTable, id: unknown, what: string, opts: { mayBeNew?: boolean } = {}) {
  if (id === null || id === undefined) return
  if (typeof id !== 'string') return reject(`${what} not found in this shop`, 'missing')
  const t = ENTITY_POLICIES[table].table
  const [row] = await ctx.tx.select({ shopId: t.shopId, deletedAt: t.deletedAt }).from(t).where(eq(t.id, id))
  if (row ? row.shopId !== ctx.shopId || row.deletedAt : !opts.mayBeNew) reject(`${what} not found in this shop`, 'missing')
}

async function mustBeMember(ctx: ApplyContext, userId: unknown, what: string, roles?: readonly Role[]) {
  if (userId === null || userId === undefined) return
  const [m] = await ctx.tx.select({ role: tables.memberships.role }).from(tables.memberships)
    .where(and(eq(tables.memberships.shopId, ctx.shopId), eq(tables.memberships.userId, String(userId))))
  if (!m || (roles && !roles.includes(m.role))) reject(`${what} is not a ${roles ? roles.join(' or ') : 'member'} of this shop`)
}

/** Rig records live only in a player's personal space, never in a shop. */
async function mustBePersonal(ctx: ApplyContext) {
  const [shop] = await ctx.tx.select({ kind: tables.shops.kind }).from(tables.shops).where(eq(tables.shops.id, ctx.shopId))
  if (shop?.kind !== 'personal') reject('rigs are kept in your own space, not in a shop', 'forbidden')
}

/** A shop may link an amp only to a rig its player shares with this shop now. */
async function mustBeSharedRig(ctx: ApplyContext, rigId: unknown) {
  const t = tables.rigShares
  const [share] = await ctx.tx.select({ id: t.id }).from(t)
    .where(and(eq(t.rigId, String(rigId)), eq(t.sharedShopId, ctx.shopId), isNull(t.deletedAt)))
  if (!share) reject('that rig is not shared with this shop')
}

/**
 * A bench result saved to a rig names one its saver may see: their own live rig, or one its player
 * shares with this shop now (and is still a member of it).
 */
async function mustSeeRig(ctx: ApplyContext, rigId: unknown) {
  if (rigId === null || rigId === undefined) return
  if (await rigOwnedBy(ctx, rigId) === ctx.userId) return
  if (!(await sharedNow(ctx, rigId))) reject('rig not found')
}

/** The player whose live rig this is (undefined: no such rig). */
async function rigOwnedBy(ctx: ApplyContext, rigId: unknown) {
  const r = tables.rigs
  const [rig] = await ctx.tx.select({ createdBy: r.createdBy }).from(r)
    .innerJoin(tables.shops, and(eq(tables.shops.id, r.shopId), eq(tables.shops.kind, 'personal')))
    .where(and(eq(r.id, String(rigId)), isNull(r.deletedAt)))
  return rig?.createdBy
}

/** Whether the rig's player shares it with this shop now and is still a member of it. */
async function sharedNow(ctx: ApplyContext, rigId: unknown) {
  const owner = await rigOwnedBy(ctx, rigId)
  if (!owner) return false
  const s = tables.rigShares
  const m = tables.memberships
  const [share] = await ctx.tx.select({ id: s.id }).from(s)
    .innerJoin(m, and(eq(m.shopId, ctx.shopId), eq(m.userId, s.createdBy)))
    .where(and(eq(s.rigId, String(rigId)), eq(s.createdBy, owner), eq(s.sharedShopId, ctx.shopId), isNull(s.deletedAt)))
  return !!share
}

function procedureFor(ctx: ApplyContext, id: unknown): ProcedureDefinition {
  const procedure = findProcedure(String(id))
  if (!procedure) return reject('there is no such procedure')
  if (!mayRun(procedure, ctx.role)) {
    reject(ctx.role === 'player' && procedure.insideChassis
      ? 'measurements inside the chassis are for qualified people: a player may run only the backstage check'
      : 'your role may not run procedures', 'forbidden')
  }
  return procedure
}

/** The result recomputed from its inputs (refused if it does not match); inputs are stored as the engine read them. */
export function checkSavedResult(fields: Record<string, unknown>) {
  const m = fields as { tool: BenchToolId, inputs: Record<string, unknown>, outputs: Record<string, unknown>, engineVersion: string }
  const verdict = verifySavedResult({ tool: m.tool, inputs: m.inputs, outputs: m.outputs, engineVersion: m.engineVersion })
  if (!verdict.ok) reject(`the saved result does not match its inputs: ${verdict.reason}`)
  return { ...fields, inputs: parseToolInputs(m.tool, m.inputs) as Record<string, unknown> }
}

const UNCHANGEABLE_RUN_FIELDS = ['procedureId', 'gateId', 'jobId', 'variant'] as const

// The gate rule: a run exists only with its own safety check, acknowledged in full by the person running it.
async function checkRun(ctx: ApplyContext, next: Record<string, unknown>, previous?: Row) {
  const run = next as EntityFields<'procedureRuns'> & { id: string, createdBy?: string }
  const before = previous as (Record<string, unknown> & Partial<EntityFields<'procedureRuns'>>) | undefined
  const procedure = procedureFor(ctx, run.procedureId)
  if (before) {
    for (const f of UNCHANGEABLE_RUN_FIELDS) if (before[f] !== next[f]) reject(`a run's ${f} cannot change once it has started`)
    if (before.status !== 'running' && run.status !== before.status) reject('a finished run cannot be reopened')
  }
  else {
    if (run.status !== 'running') reject('a new run starts running')
    if (!validVariant(procedure, run.variant)) reject(`"${run.variant}" is not a method of ${procedure.title}`)
    if (run.jobId && ctx.role === 'player') reject('runs on a job are the shop\'s work', 'forbidden')
    await mustExist(ctx, 'jobs', run.jobId, 'job')
    const t = tables.procedureGates
    const [gate] = await ctx.tx.select().from(t).where(and(eq(t.id, run.gateId), eq(t.shopId, ctx.shopId), isNull(t.deletedAt)))
    if (!gate || gate.runId !== run.id || gate.procedureId !== run.procedureId || gate.createdBy !== ctx.userId || (gate.jobId ?? null) !== (run.jobId ?? null)) {
      reject('a run needs its own acknowledged safety check, made by the person running it, before step 1')
    }
  }
  // A reading taken with a bench tool names the saved result: it must be this shop's.
  for (const [step, reading] of Object.entries(run.readings ?? {})) {
    if (reading.measurementId && reading.measurementId !== before?.readings?.[step]?.measurementId) {
      await mustExist(ctx, 'measurements', reading.measurementId, 'measurement')
    }
  }
  if (run.status === 'done' && before?.status !== 'done') {
    const e = evaluateRun(procedure, run.variant, { tubes: run.tubeCount, caps: run.capCount }, run.readings)
    if (e.outOfRange.length) reject(`the run cannot be done while a reading is out of range (${e.outOfRange.map(o => o.step.key).join(', ')}): ${e.outOfRange[0]!.reason}`)
    if (e.missing.length) reject(`the run cannot be done with steps still to do: ${e.missing.map(s => s.key).join(', ')}`)
  }
}

export const ENTITY_POLICIES: Record<EntityTable, EntityPolicy> = {
  customers: {
    table: tables.customers,
    insertsTogether: true,
    check: (ctx, next) => mustBeMember(ctx, next.playerUserId, 'the linked player', ['player']),
  },
  amps: {
    table: tables.amps,
    insertsTogether: true,
    async check(ctx, next, before) {
      await mustExist(ctx, 'customers', next.customerId, 'customer')
      if (next.rigId && next.rigId !== before?.rigId) await mustBeSharedRig(ctx, next.rigId)
    },
  },
  jobs: {
    table: tables.jobs,
    async check(ctx, next, before) {
      await mustExist(ctx, 'customers', next.customerId, 'customer')
      await mustExist(ctx, 'amps', next.ampId, 'amp')
      await mustBeMember(ctx, next.assignedTo, 'the assigned tech', ['owner', 'tech'])
      const to = next.status as JobState
      if (before && before.status !== to && !canTransition(before.status!, to)) {
        reject(`a job cannot go from ${JOB_STATE_LABELS[before.status!]} to ${JOB_STATE_LABELS[to]}`)
      }
      if (!before && to !== 'checked-in') reject('a new job starts checked in')
    },
    async after(ctx, next, before) {
      if (before && before.status === next.status) return
      await ctx.tx.insert(tables.jobEvents).values({
        id: randomUUID(), shopId: ctx.shopId, jobId: String(next.id), fromStatus: before?.status ?? null,
        toStatus: next.status as JobState, byUser: ctx.userId, at: ctx.now, version: ctx.version,
      })
      if (before && next.status === 'ready') {
        const { shopId } = ctx
        const jobId = String(next.id)
        ctx.afterCommit.push(() => sendReadyMail(shopId, jobId))
      }
    },
  },
  jobParts: {
    table: tables.jobParts,
    insertsTogether: true,
    check: (ctx, next) => mustExist(ctx, 'jobs', next.jobId, 'job'),
  },
  jobLabour: {
    table: tables.jobLabour,
    insertsTogether: true,
    async check(ctx, next) {
      await mustExist(ctx, 'jobs', next.jobId, 'job')
      await mustBeMember(ctx, next.techId, 'the tech', ['owner', 'tech'])
    },
  },
  ...STOCK_POLICIES,
  notes: {
    table: tables.notes,
    insertsTogether: true,
    ownReason: 'players may change only their own notes',
    // The job is fixed when the note is written.
    check: (ctx, next, before) => (before ? Promise.resolve() : mustExist(ctx, 'jobs', next.jobId, 'job')),
  },
  measurements: {
    table: tables.measurements,
    insertsTogether: true,
    ownReason: 'only its author or the owner may delete a measurement',
    normalise: checkSavedResult,
    async check(ctx, next) {
      await mustExist(ctx, 'jobs', next.jobId, 'job')
      await mustSeeRig(ctx, next.rigId)
    },
  },
  procedureGates: {
    table: tables.procedureGates,
    async check(ctx, next) {
      const procedure = procedureFor(ctx, next.procedureId)
      if (!gateComplete(procedure, next.items as string[])) reject(`every item of the ${procedure.title} safety check must be ticked, and only those`)
      if (next.jobId && ctx.role === 'player') reject('runs on a job are the shop\'s work', 'forbidden')
      await mustExist(ctx, 'jobs', next.jobId, 'job')
      await mustExist(ctx, 'procedureRuns', next.runId, 'run', { mayBeNew: true })
    },
  },
  procedureRuns: {
    table: tables.procedureRuns,
    ownReason: 'only the person running it (or an owner) may change a run',
    check: checkRun,
  },
  rigs: {
    table: tables.rigs,
    check: ctx => mustBePersonal(ctx),
  },
  rigTubeSets: {
    table: tables.rigTubeSets,
    insertsTogether: true,
    async check(ctx, next) {
      await mustBePersonal(ctx)
      await mustExist(ctx, 'rigs', next.rigId, 'rig')
    },
  },
  rigGigs: {
    table: tables.rigGigs,
    insertsTogether: true,
    async check(ctx, next) {
      await mustBePersonal(ctx)
      await mustExist(ctx, 'rigs', next.rigId, 'rig')
    },
  },
  rigSuggestions: {
    table: tables.rigSuggestions,
    async check(ctx, next) {
      if (next.retubeHours === null && next.retubeMonths === null) reject('suggest hours, months or both')
      if (!(await sharedNow(ctx, next.rigId))) reject('that rig is not shared with this shop, so the shop cannot suggest for it', 'forbidden')
    },
    // Who suggested it, as the server knows them (not as the device said).
    async after(ctx, next) {
      const [u] = await ctx.tx.select({ name: tables.users.name }).from(tables.users).where(eq(tables.users.id, ctx.userId))
      await ctx.tx.update(tables.rigSuggestions).set({ suggestedBy: (u?.name ?? '').slice(0, 120) }).where(eq(tables.rigSuggestions.id, String(next.id)))
    },
  },
  rigShares: {
    table: tables.rigShares,
    async check(ctx, next) {
      await mustBePersonal(ctx)
      await mustExist(ctx, 'rigs', next.rigId, 'rig')
      const s = tables.shops
      const [m] = await ctx.tx.select({ role: tables.memberships.role }).from(tables.memberships)
        .innerJoin(s, eq(s.id, tables.memberships.shopId))
        .where(and(eq(tables.memberships.shopId, String(next.sharedShopId)), eq(tables.memberships.userId, ctx.userId), eq(s.kind, 'shop'), isNull(s.deletedAt)))
      if (!m) reject('you can share a rig only with a shop you belong to')
    },
  },
}
