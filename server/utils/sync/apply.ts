import { and, eq } from 'drizzle-orm'
import type { MutationArgs, MutationName } from '#shared/utils/sync/protocol'
import { ENTITY_PREFIX, ENTITY_TABLES, entityOf, INSERT_ONLY, type EntityTable } from '#shared/utils/sync/entities'
import { isStaff, reject, type ApplyContext, type ApplyOutcome, type ApplyTable } from './context'
import { entityCreate, entityDelete, entityRestore, entitySetFields, resolveEntityField } from './apply-entities'
import { ENTITY_POLICIES } from './entity-policies'

async function conflictResolve(ctx: ApplyContext, a: MutationArgs<'conflict.resolve'>): Promise<ApplyOutcome> {
  const [c] = await ctx.tx.select().from(tables.syncConflicts)
    .where(and(eq(tables.syncConflicts.id, a.id), eq(tables.syncConflicts.shopId, ctx.shopId))).for('update')
  if (!c) reject('conflict not found')
  if (c!.status === 'resolved') reject('someone already decided this conflict')
  if (!isStaff(ctx.role) && c!.clientAuthor !== ctx.userId && c!.serverAuthor !== ctx.userId) reject('not your conflict')
  if (!(ENTITY_TABLES as readonly string[]).includes(c!.tableName)) reject('this kind of conflict cannot be resolved here')
  await resolveEntityField(ctx, c!.tableName as EntityTable, c!.rowId, c!.field, a.value)
  await ctx.tx.update(tables.syncConflicts).set({
    status: 'resolved', resolution: { value: a.value }, resolvedBy: ctx.userId, resolvedAt: ctx.now, version: ctx.version,
  }).where(eq(tables.syncConflicts.id, a.id))
  return { status: 'applied', touched: true }
}

/* eslint-disable @typescript-eslint/no-explicit-any -- args are validated by the protocol's schema for each name */
function entityAppliers() {
  const out: Record<string, (ctx: ApplyContext, args: any) => Promise<ApplyOutcome>> = {}
  for (const table of ENTITY_TABLES) {
    const p = ENTITY_PREFIX[table]
    out[`${p}.create`] = (ctx, a) => entityCreate(ctx, table, a)
    if (!(INSERT_ONLY as readonly EntityTable[]).includes(table)) out[`${p}.setFields`] = (ctx, a) => entitySetFields(ctx, table, a)
    out[`${p}.delete`] = (ctx, a) => entityDelete(ctx, table, a)
    out[`${p}.restore`] = (ctx, a) => entityRestore(ctx, table, a)
  }
  return out as unknown as Omit<ApplyTable, 'conflict.resolve'>
}
/* eslint-enable @typescript-eslint/no-explicit-any */

export const APPLY: ApplyTable = { ...entityAppliers(), 'conflict.resolve': conflictResolve }

/**
 * Whether a mutation runs in a savepoint, so that a rejection leaves nothing of it behind. A
 * create whose policy has no `after` hook needs none: entityCreate makes its one insert after
 * every check (checks only read), so once it has written it can no longer be rejected.
 */
export function needsSavepoint(name: MutationName) {
  const entity = entityOf(name)
  return !(entity?.verb === 'create' && !ENTITY_POLICIES[entity.table].after)
}
