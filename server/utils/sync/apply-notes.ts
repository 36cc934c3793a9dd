import { and, eq } from 'drizzle-orm'
import type { MutationArgs } from '#shared/utils/sync/protocol'
import { isStaff, reject, type ApplyContext, type ApplyOutcome } from './context'
import { changedByOthers, recordConflict, stampFor } from './conflicts'
import { mustExist } from './entity-policies'

const NOTE_FIELDS = ['body', 'title', 'visibility'] as const

async function lockNote(ctx: ApplyContext, id: string) {
  const [row] = await ctx.tx.select().from(tables.notes)
    .where(and(eq(tables.notes.id, id), eq(tables.notes.shopId, ctx.shopId))).for('update')
  if (!row) reject('note not found')
  if (!isStaff(ctx.role) && row!.authorId !== ctx.userId) reject('players may change only their own notes')
  return row!
}

export async function noteCreate(ctx: ApplyContext, a: MutationArgs<'note.create'>): Promise<ApplyOutcome> {
  const [existing] = await ctx.tx.select({ id: tables.notes.id, shopId: tables.notes.shopId, authorId: tables.notes.authorId })
    .from(tables.notes).where(eq(tables.notes.id, a.id))
  if (existing) reject('a record with this id already exists')
  await mustExist(ctx, 'jobs', a.jobId, 'job')
  const stamp = stampFor(ctx)
  await ctx.tx.insert(tables.notes).values({
    id: a.id,
    shopId: ctx.shopId,
    authorId: ctx.userId,
    jobId: a.jobId,
    title: a.title ?? '',
    body: a.body,
    visibility: a.visibility ?? 'internal',
    fieldStamps: { body: stamp, title: stamp, visibility: stamp },
    version: ctx.version,
    createdAt: ctx.now,
    updatedAt: ctx.now,
    updatedBy: ctx.userId,
  })
  return { status: 'applied', touched: true }
}

export async function noteSetFields(ctx: ApplyContext, a: MutationArgs<'note.setFields'>): Promise<ApplyOutcome> {
  const row = await lockNote(ctx, a.id)
  const fields = NOTE_FIELDS.filter(f => a.fields[f] !== undefined)
  if (row.deletedAt) {
    for (const f of fields) {
      await recordConflict(ctx, { tableName: 'notes', rowId: row.id, field: f, serverValue: null, clientValue: a.fields[f], serverAuthor: row.updatedBy, serverChangedAt: row.deletedAt, note: 'edited after it was deleted' })
    }
    return { status: 'conflict', touched: true, reason: 'the note was deleted' }
  }
  const stamps = { ...row.fieldStamps }
  const clashing = new Set(changedByOthers(ctx, stamps, fields))
  const set: Partial<{ body: string, title: string, visibility: 'internal' | 'customer' }> = {}
  for (const f of fields) {
    if (clashing.has(f)) {
      await recordConflict(ctx, { tableName: 'notes', rowId: row.id, field: f, serverValue: row[f], clientValue: a.fields[f], serverAuthor: stamps[f]!.u, serverChangedAt: new Date(stamps[f]!.at) })
    }
    else {
      Object.assign(set, { [f]: a.fields[f] })
      stamps[f] = stampFor(ctx)
    }
  }
  await ctx.tx.update(tables.notes).set({ ...set, fieldStamps: stamps, version: ctx.version, updatedAt: ctx.now, updatedBy: ctx.userId })
    .where(eq(tables.notes.id, row.id))
  return clashing.size
    ? { status: 'conflict', touched: true, reason: `changed by someone else: ${[...clashing].join(', ')}` }
    : { status: 'applied', touched: true }
}

export async function noteDelete(ctx: ApplyContext, a: MutationArgs<'note.delete'>): Promise<ApplyOutcome> {
  const row = await lockNote(ctx, a.id)
  if (row.deletedAt) return { status: 'applied', touched: true }
  const clashing = changedByOthers(ctx, row.fieldStamps, NOTE_FIELDS)
  if (clashing.length) {
    await recordConflict(ctx, { tableName: 'notes', rowId: row.id, field: '_delete', serverValue: { body: row.body, title: row.title }, clientValue: true, serverAuthor: row.updatedBy, serverChangedAt: row.updatedAt, note: 'deleted after someone else edited it' })
    await ctx.tx.update(tables.notes).set({ version: ctx.version }).where(eq(tables.notes.id, row.id))
    return { status: 'conflict', touched: true, reason: 'edited by someone else since you last saw it' }
  }
  await ctx.tx.update(tables.notes).set({ deletedAt: ctx.now, version: ctx.version, updatedBy: ctx.userId }).where(eq(tables.notes.id, row.id))
  return { status: 'applied', touched: true }
}

export async function noteRestore(ctx: ApplyContext, a: MutationArgs<'note.restore'>): Promise<ApplyOutcome> {
  const row = await lockNote(ctx, a.id)
  await ctx.tx.update(tables.notes).set({ deletedAt: null, version: ctx.version, updatedBy: ctx.userId }).where(eq(tables.notes.id, row.id))
  return { status: 'applied', touched: true }
}

/** Apply a person's decision on a note conflict: the chosen or merged value becomes the note's. */
export async function resolveNoteField(ctx: ApplyContext, rowId: string, field: string, value: unknown) {
  const row = await lockNote(ctx, rowId)
  if (field === '_delete') {
    if (value === true) await ctx.tx.update(tables.notes).set({ deletedAt: ctx.now, version: ctx.version }).where(eq(tables.notes.id, rowId))
    else await ctx.tx.update(tables.notes).set({ version: ctx.version }).where(eq(tables.notes.id, rowId))
    return
  }
  if (field !== 'body' && field !== 'title' && field !== 'visibility') reject('unknown field')
  if (field === 'visibility' && value !== 'internal' && value !== 'customer') reject('visibility must be internal or customer')
  if (typeof value !== 'string' || value.length > (field === 'body' ? 20_000 : 200)) reject(`${field} must be text`)
  const stamps = { ...row.fieldStamps, [field]: stampFor(ctx) }
  await ctx.tx.update(tables.notes).set({ [field]: value, fieldStamps: stamps, deletedAt: null, version: ctx.version, updatedAt: ctx.now, updatedBy: ctx.userId })
    .where(eq(tables.notes.id, rowId))
}
