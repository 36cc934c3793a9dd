import { and, eq } from 'drizzle-orm'
import type { MutationArgs } from '#shared/utils/sync/protocol'
import { isStaff, reject, type ApplyContext, type ApplyOutcome, type ApplyTable } from './context'
import { noteCreate, noteDelete, noteRestore, noteSetFields, resolveNoteField } from './apply-notes'
import { measurementCreate, measurementDelete } from './apply-measurements'

async function conflictResolve(ctx: ApplyContext, a: MutationArgs<'conflict.resolve'>): Promise<ApplyOutcome> {
  const [c] = await ctx.tx.select().from(tables.syncConflicts)
    .where(and(eq(tables.syncConflicts.id, a.id), eq(tables.syncConflicts.shopId, ctx.shopId))).for('update')
  if (!c) reject('conflict not found')
  if (c!.status === 'resolved') reject('someone already decided this conflict')
  if (!isStaff(ctx.role) && c!.clientAuthor !== ctx.userId && c!.serverAuthor !== ctx.userId) reject('not your conflict')
  if (c!.tableName === 'notes') await resolveNoteField(ctx, c!.rowId, c!.field, a.value)
  else reject('this kind of conflict cannot be resolved yet')
  await ctx.tx.update(tables.syncConflicts).set({
    status: 'resolved', resolution: { value: a.value }, resolvedBy: ctx.userId, resolvedAt: ctx.now, version: ctx.version,
  }).where(eq(tables.syncConflicts.id, a.id))
  return { status: 'applied', touched: true }
}

export const APPLY: ApplyTable = {
  'note.create': noteCreate,
  'note.setFields': noteSetFields,
  'note.delete': noteDelete,
  'note.restore': noteRestore,
  'measurement.create': measurementCreate,
  'measurement.delete': measurementDelete,
  'conflict.resolve': conflictResolve,
}
