import { index, int, json, mysqlEnum, mysqlTable, varchar } from 'drizzle-orm/mysql-core'
import { RUN_STATUSES } from '../../../shared/utils/sync/entities'
import type { StepReading } from '../../../shared/utils/procedures/types'
import { synced, uuid } from './columns'

/** An acknowledged safety check: who ticked which hazards, when, for which run. Never edited. */
export const procedureGates = mysqlTable('procedure_gates', {
  ...synced(),
  runId: uuid('run_id').notNull(),
  procedureId: varchar('procedure_id', { length: 64 }).notNull(),
  jobId: uuid('job_id'),
  items: json('items').$type<string[]>().notNull(),
  acknowledgedAt: varchar('acknowledged_at', { length: 40 }).notNull(),
}, t => [
  index('procedure_gates_shop_version_idx').on(t.shopId, t.version),
  index('procedure_gates_run_idx').on(t.runId),
])

/** One run of a procedure: where it stands, what was read at each step, the warnings on the way. */
export const procedureRuns = mysqlTable('procedure_runs', {
  ...synced(),
  procedureId: varchar('procedure_id', { length: 64 }).notNull(),
  gateId: uuid('gate_id').notNull(),
  variant: varchar('variant', { length: 40 }).notNull().default(''),
  jobId: uuid('job_id'),
  tubeCount: int('tube_count').notNull().default(2),
  capCount: int('cap_count').notNull().default(3),
  status: mysqlEnum('status', RUN_STATUSES).notNull().default('running'),
  stepIndex: int('step_index').notNull().default(0),
  readings: json('readings').$type<Record<string, StepReading>>().notNull(),
  warnings: json('warnings').$type<{ step: string, text: string, value?: number, at: string }[]>().notNull(),
  endedAt: varchar('ended_at', { length: 40 }).notNull().default(''),
  endReason: varchar('end_reason', { length: 500 }).notNull().default(''),
}, t => [
  index('procedure_runs_shop_version_idx').on(t.shopId, t.version),
  index('procedure_runs_job_idx').on(t.jobId),
])
