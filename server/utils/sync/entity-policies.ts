import { and, eq, isNull } from 'drizzle-orm'
import type { MySqlTableWithColumns } from 'drizzle-orm/mysql-core'
import { randomUUID } from 'node:crypto'
import type { EntityTable } from '#shared/utils/sync/entities'
import type { Role } from '#shared/utils/roles'
import { canTransition, JOB_STATE_LABELS, type JobState } from '#shared/utils/jobs/states'
import { reject, type ApplyContext } from './context'

type Row = Record<string, unknown> & { id: string, status?: JobState }

export interface EntityPolicy {
  // eslint-disable-next-line @typescript-eslint/no-explicit-any -- each entry is one of the entity tables
  table: MySqlTableWithColumns<any>
  create: readonly Role[]
  update: readonly Role[]
  remove: readonly Role[]
  /** Refuse a record that points at something outside this shop. */
  check?: (ctx: ApplyContext, next: Record<string, unknown>, before?: Row) => Promise<void>
  /** Rows the server writes alongside (the job timeline). */
  after?: (ctx: ApplyContext, next: Record<string, unknown>, before?: Row) => Promise<void>
}

async function mustExist(ctx: ApplyContext, table: EntityTable, id: unknown, what: string) {
  if (typeof id !== 'string') return
  const t = ENTITY_POLICIES[table].table
  const [row] = await ctx.tx.select({ id: t.id }).from(t).where(and(eq(t.id, id), eq(t.shopId, ctx.shopId), isNull(t.deletedAt)))
  if (!row) reject(`${what} not found in this shop`)
}

async function mustBeMember(ctx: ApplyContext, userId: unknown, what: string, roles?: readonly Role[]) {
  if (userId === null || userId === undefined) return
  const [m] = await ctx.tx.select({ role: tables.memberships.role }).from(tables.memberships)
    .where(and(eq(tables.memberships.shopId, ctx.shopId), eq(tables.memberships.userId, String(userId))))
  if (!m || (roles && !roles.includes(m.role))) reject(`${what} is not a ${roles ? roles.join(' or ') : 'member'} of this shop`)
}

export const ENTITY_POLICIES: Record<EntityTable, EntityPolicy> = {
  customers: {
    table: tables.customers,
    create: ['owner', 'desk'],
    update: ['owner', 'desk'],
    remove: ['owner'],
    check: (ctx, next) => mustBeMember(ctx, next.playerUserId, 'the linked player', ['player']),
  },
  amps: {
    table: tables.amps,
    create: ['owner', 'desk', 'tech'],
    update: ['owner', 'desk', 'tech'],
    remove: ['owner'],
    check: (ctx, next) => mustExist(ctx, 'customers', next.customerId, 'customer'),
  },
  jobs: {
    table: tables.jobs,
    create: ['owner', 'desk'],
    update: ['owner', 'desk', 'tech'],
    remove: ['owner'],
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
    create: ['owner', 'tech'],
    update: ['owner', 'tech'],
    remove: ['owner', 'tech'],
    check: (ctx, next) => mustExist(ctx, 'jobs', next.jobId, 'job'),
  },
  jobLabour: {
    table: tables.jobLabour,
    create: ['owner', 'tech'],
    update: ['owner', 'tech'],
    remove: ['owner', 'tech'],
    async check(ctx, next) {
      await mustExist(ctx, 'jobs', next.jobId, 'job')
      await mustBeMember(ctx, next.techId, 'the tech', ['owner', 'tech'])
    },
  },
}
