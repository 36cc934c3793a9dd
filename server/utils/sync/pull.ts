import { and, asc, eq, gt, lte, or, type SQL } from 'drizzle-orm'
import { PULL_PAGE_SIZE, SYNC_SCHEMA_VERSION, type PullBody, type PullReply, type RowChange, type SyncedTable } from '#shared/utils/sync/protocol'
import type { Role } from '#shared/utils/roles'
import type { Tx } from '../db'
import { isStaff } from './context'
import { withRetry } from './errors'
import { registerClient } from './push'

interface Cookie { v: number, s: number, r: string, m: number }

function readCookie(raw: string | null): Cookie | null {
  if (!raw) return null
  try {
    const c = JSON.parse(Buffer.from(raw, 'base64url').toString('utf8')) as Cookie
    return Number.isInteger(c.v) && c.v >= 0 ? c : null
  }
  catch {
    return null
  }
}
const writeCookie = (c: Cookie) => Buffer.from(JSON.stringify(c)).toString('base64url')

const iso = (d: Date | null) => (d ? d.toISOString() : null)

type Access = { userId: string, shopId: string, role: Role }

async function readNotes(tx: Tx, a: Access, from: number, to: number): Promise<RowChange[]> {
  const t = tables.notes
  const mine: SQL | undefined = isStaff(a.role) ? undefined : eq(t.authorId, a.userId)
  const rows = await tx.select().from(t)
    .where(and(eq(t.shopId, a.shopId), gt(t.version, from), lte(t.version, to), mine))
    .orderBy(asc(t.version)).limit(PULL_PAGE_SIZE + 1)
  return rows.map(r => ({
    table: 'notes', id: r.id, version: r.version, deleted: !!r.deletedAt,
    data: {
      jobId: r.jobId, title: r.title, body: r.body, authorId: r.authorId, updatedBy: r.updatedBy,
      createdAt: iso(r.createdAt), updatedAt: iso(r.updatedAt), deletedAt: iso(r.deletedAt),
      fieldVersions: Object.fromEntries(Object.entries(r.fieldStamps).map(([k, s]) => [k, s.v])),
    },
  }))
}

async function readMeasurements(tx: Tx, a: Access, from: number, to: number): Promise<RowChange[]> {
  const t = tables.measurements
  const mine = isStaff(a.role) ? undefined : eq(t.authorId, a.userId)
  const rows = await tx.select().from(t)
    .where(and(eq(t.shopId, a.shopId), gt(t.version, from), lte(t.version, to), mine))
    .orderBy(asc(t.version)).limit(PULL_PAGE_SIZE + 1)
  return rows.map(r => ({
    table: 'measurements', id: r.id, version: r.version, deleted: !!r.deletedAt,
    data: {
      jobId: r.jobId, rigId: r.rigId, tool: r.tool, inputs: r.inputs, outputs: r.outputs, engineVersion: r.engineVersion,
      label: r.label, authorId: r.authorId, createdAt: iso(r.createdAt), deletedAt: iso(r.deletedAt),
    },
  }))
}

async function readConflicts(tx: Tx, a: Access, from: number, to: number): Promise<RowChange[]> {
  const t = tables.syncConflicts
  const mine = isStaff(a.role) ? undefined : or(eq(t.clientAuthor, a.userId), eq(t.serverAuthor, a.userId))
  const rows = await tx.select().from(t)
    .where(and(eq(t.shopId, a.shopId), gt(t.version, from), lte(t.version, to), mine))
    .orderBy(asc(t.version)).limit(PULL_PAGE_SIZE + 1)
  return rows.map(r => ({
    table: 'conflicts', id: r.id, version: r.version, deleted: false,
    data: {
      tableName: r.tableName as SyncedTable, rowId: r.rowId, field: r.field, serverValue: r.serverValue, clientValue: r.clientValue,
      serverAuthor: r.serverAuthor, clientAuthor: r.clientAuthor, serverChangedAt: iso(r.serverChangedAt), clientChangedAt: iso(r.clientChangedAt),
      status: r.status, resolution: r.resolution, resolvedBy: r.resolvedBy, resolvedAt: iso(r.resolvedAt), note: r.note,
    },
  }))
}

export async function handlePull(access: Access & { memberSince: number }, body: PullBody): Promise<PullReply> {
  if (body.schemaVersion !== SYNC_SCHEMA_VERSION) {
    throw createError({ statusCode: 426, message: 'This version of the app is out of date. Reload to update.' })
  }
  await withRetry(() => registerClient(body.clientId, access.userId, access.shopId))
  return withRetry(() => useDb().transaction(async (tx) => {
    const [shop] = await tx.select().from(tables.shopVersions).where(eq(tables.shopVersions.shopId, access.shopId))
    const [client] = await tx.select({ lmid: tables.syncClients.lmid }).from(tables.syncClients).where(eq(tables.syncClients.id, body.clientId))
    const current = shop?.version ?? 0
    const cookie = readCookie(body.cookie)
    // A new role or membership changes what this user may see: start over.
    const reset = !cookie || cookie.s !== SYNC_SCHEMA_VERSION || cookie.r !== access.role || cookie.m !== access.memberSince
      || cookie.v < (shop?.horizon ?? 0) || cookie.v > current
    const from = reset ? 0 : cookie!.v

    const parts = await Promise.all([readNotes(tx, access, from, current), readMeasurements(tx, access, from, current), readConflicts(tx, access, from, current)])
    const all = parts.flat().sort((x, y) => x.version - y.version)
    let upTo = current
    let more = false
    // A table that filled its page may hold more rows of its last version: stop before it.
    for (const p of parts) {
      if (p.length > PULL_PAGE_SIZE) {
        upTo = Math.min(upTo, p.at(-1)!.version - 1)
        more = true
      }
    }
    const kept = all.filter(c => c.version <= upTo)
    if (kept.length > PULL_PAGE_SIZE) {
      // Cut after a whole version, so a mutation's rows never straddle two pages.
      upTo = kept[PULL_PAGE_SIZE - 1]!.version
      more = true
    }
    if (upTo <= from && all.length) upTo = all[0]!.version
    const changes = all.filter(c => c.version <= upTo)
    return {
      cookie: writeCookie({ v: upTo, s: SYNC_SCHEMA_VERSION, r: access.role, m: access.memberSince }),
      lmid: client?.lmid ?? 0,
      reset,
      more,
      changes,
    }
  }, { isolationLevel: 'repeatable read', withConsistentSnapshot: true }))
}
