import { and, eq } from 'drizzle-orm'
import { parseToolInputs, verifySavedResult } from '#shared/utils/bench'
import type { MutationArgs } from '#shared/utils/sync/protocol'
import { reject, type ApplyContext, type ApplyOutcome } from './context'
import { mustExist } from './entity-policies'

export const MEASURING_ROLES = ['owner', 'tech', 'player'] as const

/** Recomputes the result; returns the normalised inputs or throws a Rejection with the reason. */
export function checkSavedResult(a: MutationArgs<'measurement.create'>) {
  const verdict = verifySavedResult({ tool: a.tool, inputs: a.inputs, outputs: a.outputs, engineVersion: a.engineVersion })
  if (!verdict.ok) reject(`the saved result does not match its inputs: ${verdict.reason}`)
  return parseToolInputs(a.tool, a.inputs) as Record<string, unknown>
}

export async function measurementCreate(ctx: ApplyContext, a: MutationArgs<'measurement.create'>): Promise<ApplyOutcome> {
  if (!(MEASURING_ROLES as readonly string[]).includes(ctx.role)) reject('your role does not save bench results')
  const inputs = checkSavedResult(a)
  const [existing] = await ctx.tx.select({ id: tables.measurements.id }).from(tables.measurements).where(eq(tables.measurements.id, a.id))
  if (existing) reject('a record with this id already exists')
  await mustExist(ctx, 'jobs', a.jobId, 'job')
  // A rig is a player's amp record.
  await mustExist(ctx, 'amps', a.rigId, 'rig')
  await ctx.tx.insert(tables.measurements).values({
    id: a.id,
    shopId: ctx.shopId,
    authorId: ctx.userId,
    jobId: a.jobId ?? null,
    rigId: a.rigId ?? null,
    tool: a.tool,
    inputs,
    outputs: a.outputs,
    engineVersion: a.engineVersion,
    label: a.label ?? null,
    version: ctx.version,
    createdAt: ctx.now,
    updatedAt: ctx.now,
  })
  return { status: 'applied', touched: true }
}

export async function measurementDelete(ctx: ApplyContext, a: MutationArgs<'measurement.delete'>): Promise<ApplyOutcome> {
  const [row] = await ctx.tx.select().from(tables.measurements)
    .where(and(eq(tables.measurements.id, a.id), eq(tables.measurements.shopId, ctx.shopId))).for('update')
  if (!row) reject('measurement not found')
  if (row!.authorId !== ctx.userId && ctx.role !== 'owner') reject('only its author or the owner may delete a measurement')
  await ctx.tx.update(tables.measurements).set({ deletedAt: ctx.now, version: ctx.version }).where(eq(tables.measurements.id, a.id))
  return { status: 'applied', touched: true }
}
