import { and, eq } from 'drizzle-orm'
import { ENTITY_FIELDS, parseEntityCreate, type EntityTable } from '#shared/utils/sync/entities'
import { ownOnly, rolesFor, type Verb } from '#shared/utils/permissions'
import type { FieldStamps } from '../../db/schema/columns'
import { reject, type ApplyContext, type ApplyOutcome } from './context'
import { changedByOthers, recordConflict, stampFor } from './conflicts'
import { ENTITY_POLICIES } from './entity-policies'
import { holdsTogether } from './held-inserts'

const WORDS: Record<Verb, string> = { read: 'read', create: 'create', update: 'change', remove: 'delete', pay: 'pay' }

function allowed(ctx: ApplyContext, table: EntityTable, verb: Verb, word = WORDS[verb]) {
  if (!rolesFor(table, verb).includes(ctx.role)) reject(`your role may not ${word} ${table}`, 'forbidden')
}

type LockedRow = Record<string, unknown> & { id: string, fieldStamps: FieldStamps, createdBy: string, deletedAt: Date | null, updatedBy: string | null, updatedAt: Date }

/** The row, locked for this transaction; refused if it is not this shop's or (for an own-only role) not the person's. */
async function lock(ctx: ApplyContext, table: EntityTable, id: string, verb: Verb) {
  const policy = ENTITY_POLICIES[table]
  const t = policy.table
  const [row] = await ctx.tx.select().from(t).where(and(eq(t.id, id), eq(t.shopId, ctx.shopId))).for('update')
  if (!row) reject(`${table} record not found`, 'missing')
  const locked = row as LockedRow
  if (locked.createdBy !== ctx.userId && ownOnly(ctx.role, table, verb)) reject(policy.ownReason ?? `you may ${WORDS[verb]} only your own ${table}`, 'forbidden')
  return locked
}

/** What a record held, for the side of a conflict that kept it. */
const fieldsOf = (table: EntityTable, row: Record<string, unknown>) => Object.fromEntries(Object.keys(ENTITY_FIELDS[table].shape).map(k => [k, row[k]]))

/** Whether a record of this kind has the id already, in any shop. */
async function idTaken(ctx: ApplyContext, table: EntityTable, id: string) {
  if (ctx.createIds) return ctx.createIds.isTaken(ctx.tx, table, id)
  const t = ENTITY_POLICIES[table].table
  const [existing] = await ctx.tx.select({ id: t.id }).from(t).where(eq(t.id, id))
  return !!existing
}

export async function entityCreate(ctx: ApplyContext, table: EntityTable, args: { id: string } & Record<string, unknown>): Promise<ApplyOutcome> {
  const policy = ENTITY_POLICIES[table]
  allowed(ctx, table, 'create')
  const parsed = parseEntityCreate(table, args)
  if (!parsed.success) reject(zodMessage(parsed.error))
  const fields = policy.normalise ? policy.normalise(parsed.data as Record<string, unknown>) : parsed.data as Record<string, unknown>
  const t = policy.table
  if (await idTaken(ctx, table, args.id)) reject('a record with this id already exists')
  const next = { ...fields, id: args.id }
  await policy.check?.(ctx, next)
  const stamp = stampFor(ctx)
  const row = {
    ...fields, id: args.id, shopId: ctx.shopId, version: ctx.version, createdBy: ctx.userId, updatedBy: ctx.userId,
    createdAt: ctx.now, updatedAt: ctx.now, fieldStamps: Object.fromEntries(Object.keys(fields).map(k => [k, stamp])),
  }
  // The only write before `after`, once every check has passed (see needsSavepoint).
  if (ctx.held && holdsTogether(table)) await ctx.held.hold(ctx.tx, table, row)
  else await ctx.tx.insert(t).values(row)
  await policy.after?.(ctx, next)
  return { status: 'applied', touched: true }
}

export async function entitySetFields(ctx: ApplyContext, table: EntityTable, args: { id: string, fields: Record<string, unknown> }): Promise<ApplyOutcome> {
  const policy = ENTITY_POLICIES[table]
  allowed(ctx, table, 'update')
  const row = await lock(ctx, table, args.id, 'update')
  const keys = Object.keys(args.fields).filter(k => args.fields[k] !== undefined && k in ENTITY_FIELDS[table].shape)
  if (row.deletedAt) {
    for (const k of keys) {
      await recordConflict(ctx, { tableName: table, rowId: row.id, field: k, serverValue: null, clientValue: args.fields[k], serverAuthor: row.updatedBy, serverChangedAt: row.deletedAt, note: 'edited after it was deleted' })
    }
    return { status: 'conflict', touched: true, reason: 'the record was deleted' }
  }
  policy.guard?.(ctx, args.fields, row as never)
  const stamps = { ...row.fieldStamps }
  const clashing = changedByOthers(ctx, stamps, keys)
  const set: Record<string, unknown> = {}
  for (const k of keys) {
    if (!clashing.includes(k)) {
      set[k] = args.fields[k]
      stamps[k] = stampFor(ctx)
    }
  }
  const next = { ...row, ...set }
  await policy.check?.(ctx, next, row as never)
  for (const k of clashing) {
    await recordConflict(ctx, { tableName: table, rowId: row.id, field: k, serverValue: row[k], clientValue: args.fields[k], serverAuthor: stamps[k]!.u, serverChangedAt: new Date(stamps[k]!.at) })
  }
  await ctx.tx.update(policy.table).set({ ...set, fieldStamps: stamps, version: ctx.version, updatedAt: ctx.now, updatedBy: ctx.userId })
    .where(eq(policy.table.id, row.id))
  await policy.after?.(ctx, next, row as never)
  return clashing.length
    ? { status: 'conflict', touched: true, reason: `changed by someone else: ${clashing.join(', ')}` }
    : { status: 'applied', touched: true }
}

export async function entityDelete(ctx: ApplyContext, table: EntityTable, args: { id: string }): Promise<ApplyOutcome> {
  const policy = ENTITY_POLICIES[table]
  allowed(ctx, table, 'remove')
  const row = await lock(ctx, table, args.id, 'remove')
  if (row.deletedAt) return { status: 'applied', touched: true }
  await policy.beforeDelete?.(ctx, row as never)
  const clashing = changedByOthers(ctx, row.fieldStamps, Object.keys(row.fieldStamps))
  if (clashing.length) {
    await recordConflict(ctx, { tableName: table, rowId: row.id, field: '_delete', serverValue: fieldsOf(table, row), clientValue: true, serverAuthor: row.updatedBy, serverChangedAt: row.updatedAt, note: 'deleted after someone else edited it' })
    await ctx.tx.update(policy.table).set({ version: ctx.version }).where(eq(policy.table.id, row.id))
    return { status: 'conflict', touched: true, reason: 'edited by someone else since you last saw it' }
  }
  await ctx.tx.update(policy.table).set({ deletedAt: ctx.now, version: ctx.version, updatedBy: ctx.userId }).where(eq(policy.table.id, row.id))
  return { status: 'applied', touched: true }
}

export async function entityRestore(ctx: ApplyContext, table: EntityTable, args: { id: string }): Promise<ApplyOutcome> {
  const policy = ENTITY_POLICIES[table]
  allowed(ctx, table, 'remove', 'restore')
  const row = await lock(ctx, table, args.id, 'remove')
  await ctx.tx.update(policy.table).set({ deletedAt: null, version: ctx.version, updatedBy: ctx.userId }).where(eq(policy.table.id, row.id))
  return { status: 'applied', touched: true }
}

/** A person's decision on an entity field conflict. */
export async function resolveEntityField(ctx: ApplyContext, table: EntityTable, rowId: string, field: string, value: unknown) {
  const policy = ENTITY_POLICIES[table]
  const verb = field === '_delete' ? 'remove' : 'update'
  allowed(ctx, table, verb)
  const row = await lock(ctx, table, rowId, verb)
  if (field === '_delete') {
    if (value === true) await policy.beforeDelete?.(ctx, row as never)
    await ctx.tx.update(policy.table).set({ deletedAt: value === true ? ctx.now : null, version: ctx.version }).where(eq(policy.table.id, rowId))
    return
  }
  const shape = ENTITY_FIELDS[table].shape as Record<string, { safeParse: (v: unknown) => { success: boolean } }>
  if (!shape[field]) reject('unknown field')
  if (!shape[field]!.safeParse(value).success) reject(`${field}: not a valid value`)
  const next = { ...row, [field]: value }
  await policy.check?.(ctx, next, row as never)
  await ctx.tx.update(policy.table).set({ [field]: value, fieldStamps: { ...row.fieldStamps, [field]: stampFor(ctx) }, deletedAt: null, version: ctx.version, updatedAt: ctx.now, updatedBy: ctx.userId })
    .where(eq(policy.table.id, rowId))
  await policy.after?.(ctx, next, row as never)
}
