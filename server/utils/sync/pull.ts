import { createHash } from 'node:crypto'
import { and, asc, eq, getTableName, gt, inArray, isNull, lte, ne, or, sql, type SQL } from 'drizzle-orm'
import { escape } from 'mysql2'
import { ENTITY_FIELDS, ENTITY_TABLES, type EntityTable } from '#shared/utils/sync/entities'
import { ENTITY_POLICIES } from './entity-policies'
import { PULL_PAGE_SIZE, SYNC_SCHEMA_VERSION, type PullBody, type PullReply, type RowChange, type SyncedTable } from '#shared/utils/sync/protocol'
import type { Role } from '#shared/utils/roles'
import type { Tx } from '../db'
import { isStaff } from './context'
import { registerClient } from './push'

interface Cookie { v: number, s: number, r: string, m: number, p?: string }

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
/** What a player may see: their linked customer records and those customers' jobs. */
interface Scope { customerIds: string[], jobIds: string[], rigIds: string[] }

const NONE = '00000000-0000-0000-0000-000000000000'
const inIds = (col: Parameters<typeof inArray>[0], ids: string[]) => inArray(col, ids.length ? ids : [NONE])

async function playerScope(tx: Tx, a: Access): Promise<Scope | null> {
  if (isStaff(a.role)) return null
  const cs = await tx.select({ id: tables.customers.id }).from(tables.customers)
    .where(and(eq(tables.customers.shopId, a.shopId), eq(tables.customers.playerUserId, a.userId), isNull(tables.customers.deletedAt)))
  const customerIds = cs.map(c => c.id)
  const js = await tx.select({ id: tables.jobs.id }).from(tables.jobs).where(and(eq(tables.jobs.shopId, a.shopId), inIds(tables.jobs.customerId, customerIds)))
  const rs = await tx.select({ id: tables.rigs.id }).from(tables.rigs).where(eq(tables.rigs.createdBy, a.userId))
  return { customerIds, jobIds: js.map(j => j.id), rigIds: rs.map(r => r.id) }
}

type EntityColumns = (typeof ENTITY_POLICIES)[EntityTable]['table']

/** What a player pulls of each record; staff pull the whole shop. */
const PLAYER_SEES: Record<EntityTable, (t: EntityColumns, a: Access, scope: Scope) => SQL | undefined> = {
  customers: (t, _a, s) => inIds(t.id, s.customerIds),
  amps: (t, _a, s) => inIds(t.customerId, s.customerIds),
  jobs: (t, _a, s) => inIds(t.id, s.jobIds),
  jobParts: (t, _a, s) => inIds(t.jobId, s.jobIds),
  jobLabour: (t, _a, s) => inIds(t.jobId, s.jobIds),
  // Shop tube stock is the shop's own business: a fitted set reaches the player as a job part.
  tubeLots: t => inIds(t.id, []),
  stockTubes: t => inIds(t.id, []),
  matchedSets: t => inIds(t.id, []),
  // Their own notes, and the shop's notes on their jobs written for the customer.
  notes: (t, a, s) => or(eq(t.createdBy, a.userId), and(inIds(t.jobId, s.jobIds), eq(t.visibility, 'customer'))),
  measurements: (t, a, s) => or(eq(t.createdBy, a.userId), inIds(t.jobId, s.jobIds)),
  // A player's own backstage checks, and the runs on their jobs (the service record shows them).
  procedureGates: (t, a, s) => or(eq(t.createdBy, a.userId), inIds(t.jobId, s.jobIds)),
  procedureRuns: (t, a, s) => or(eq(t.createdBy, a.userId), inIds(t.jobId, s.jobIds)),
  // Rig records live in the player's personal space, where they are the only member.
  rigs: (t, a) => eq(t.createdBy, a.userId),
  rigTubeSets: (t, a) => eq(t.createdBy, a.userId),
  rigGigs: (t, a) => eq(t.createdBy, a.userId),
  rigShares: (t, a) => eq(t.createdBy, a.userId),
  // In a shop: what the shop suggests for the player's own rigs.
  rigSuggestions: (t, _a, s) => inIds(t.rigId, s.rigIds),
}

/**
 * The record tables with any row in (from, to], in one query: a page usually comes from one or
 * two tables, and asking each of the others on its own was most of a page's round trips.
 */
async function tablesWithChanges(tx: Tx, shopId: string, from: number, to: number): Promise<Set<EntityTable>> {
  const probes = ENTITY_TABLES.map(table => `(select ${escape(table)} as t from \`${getTableName(ENTITY_POLICIES[table].table)}\` where shop_id = ${escape(shopId)} and version > ${Number(from)} and version <= ${Number(to)} limit 1)`)
  const [rows] = await tx.execute(sql.raw(probes.join(' union all '))) as unknown as [{ t: EntityTable }[]]
  return new Set(rows.map(r => r.t))
}

async function readEntities(tx: Tx, a: Access, scope: Scope | null, table: EntityTable, from: number, to: number): Promise<RowChange[]> {
  const t = ENTITY_POLICIES[table].table
  const rows = await tx.select().from(t)
    .where(and(eq(t.shopId, a.shopId), gt(t.version, from), lte(t.version, to), scope ? PLAYER_SEES[table](t, a, scope) : undefined))
    .orderBy(asc(t.version)).limit(PULL_PAGE_SIZE + 1) as (Record<string, unknown> & { id: string, version: number, deletedAt: Date | null, fieldStamps: Record<string, { v: number }> })[]
  const keys = Object.keys(ENTITY_FIELDS[table].shape)
  return rows.map(r => ({
    table, id: r.id, version: r.version, deleted: !!r.deletedAt,
    data: {
      ...Object.fromEntries(keys.map(k => [k, r[k]])),
      createdBy: r.createdBy, updatedBy: r.updatedBy,
      createdAt: iso(r.createdAt as Date), updatedAt: iso(r.updatedAt as Date), deletedAt: iso(r.deletedAt),
      fieldVersions: Object.fromEntries(Object.entries(r.fieldStamps).map(([k, s]) => [k, s.v])),
    },
  }))
}

async function readJobEvents(tx: Tx, a: Access, scope: Scope | null, from: number, to: number): Promise<RowChange[]> {
  const t = tables.jobEvents
  const rows = await tx.select().from(t)
    .where(and(eq(t.shopId, a.shopId), gt(t.version, from), lte(t.version, to), scope ? inIds(t.jobId, scope.jobIds) : undefined))
    .orderBy(asc(t.version)).limit(PULL_PAGE_SIZE + 1)
  return rows.map(r => ({ table: 'jobEvents', id: r.id, version: r.version, deleted: false, data: { jobId: r.jobId, from: r.fromStatus, to: r.toStatus, by: r.byUser, at: iso(r.at) } }))
}

async function readInvoices(tx: Tx, a: Access, scope: Scope | null, from: number, to: number): Promise<RowChange[]> {
  const t = tables.invoices
  // A draft is the shop's working copy: the customer sees it once it is sent.
  const rows = await tx.select().from(t)
    .where(and(eq(t.shopId, a.shopId), gt(t.version, from), lte(t.version, to), scope ? and(inIds(t.jobId, scope.jobIds), ne(t.state, 'draft')) : undefined))
    .orderBy(asc(t.version)).limit(PULL_PAGE_SIZE + 1)
  return rows.map(r => ({
    table: 'invoices', id: r.id, version: r.version, deleted: r.state === 'void',
    data: {
      jobId: r.jobId, number: r.number, kind: r.kind, state: r.state, lines: r.lines, partsCents: r.partsCents, labourCents: r.labourCents,
      subtotalCents: r.subtotalCents, taxRateBasisPoints: r.taxRateBasisPoints, taxCents: r.taxCents, totalCents: r.totalCents,
      currency: r.currency, issuedAt: iso(r.issuedAt), paidAt: iso(r.paidAt), paidWith: r.paidWith, createdAt: iso(r.createdAt),
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
    const scope = await playerScope(tx, access)
    const scopeKey = scope ? createHash('sha256').update(scope.customerIds.sort().join(',')).digest('hex').slice(0, 16) : ''
    // A new role, membership or linked customer changes what this user may see: start over.
    const reset = !cookie || cookie.s !== SYNC_SCHEMA_VERSION || cookie.r !== access.role || cookie.m !== access.memberSince
      || (cookie.p ?? '') !== scopeKey || cookie.v < (shop?.horizon ?? 0) || cookie.v > current
    const from = reset ? 0 : cookie!.v

    const changed = await tablesWithChanges(tx, access.shopId, from, current)
    const parts = await Promise.all([
      readConflicts(tx, access, from, current),
      ...ENTITY_TABLES.filter(t => changed.has(t)).map(t => readEntities(tx, access, scope, t, from, current)),
      readJobEvents(tx, access, scope, from, current),
      readInvoices(tx, access, scope, from, current),
    ])
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
      cookie: writeCookie({ v: upTo, s: SYNC_SCHEMA_VERSION, r: access.role, m: access.memberSince, p: scopeKey }),
      lmid: client?.lmid ?? 0,
      reset,
      more,
      changes,
    }
  }, { isolationLevel: 'repeatable read', withConsistentSnapshot: true }))
}
