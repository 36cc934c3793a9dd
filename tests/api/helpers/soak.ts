// The convergence soak: several devices make random changes through a lossy network, then
// sync until quiet. Used by the API suite (smaller count) and by `npm run soak` (full size).
import { randomUUID } from 'node:crypto'
import { computeTool, ENGINE_VERSION } from '../../../shared/utils/bench'
import { device, eventually, prng, shopWithMembers, type Device, NO_FAULTS } from './devices'
import { sql } from './db'
import type { Client } from './client'

export interface SoakOptions {
  clients: number
  mutations: number
  seed: number
  restartRate?: number
  /** The HTTP client device `i` syncs through (the cluster soak pushes to one node and pulls from another). */
  via?: (http: Client, i: number) => Client
  /** Awaited after the lossy phase, before the quiet rounds (the cluster soak waits for its node to rejoin). */
  beforeQuiet?: () => Promise<void>
}
export interface SoakReport {
  shopId: string
  mutations: number
  loggedUuids: number
  rounds: number
  converged: boolean
  duplicateRows: number
  notesOnServer: number
  noteCreatesApplied: number
  outboxLeft: number
  conflicts: number
  conflictsWithLosingValue: number
  rejected: number
  restarts: number
}

const IDLE_INPUTS = { mode: 'fixed', maxPlateWatts: 14, plateVolts: 285, method: 'direct', amps: 0.035 }

async function randomChange(d: Device, rand: () => number) {
  const notes = await d.db.notes.where('shopId').equals(d.engine.shopId).filter(n => !n.deleted).toArray()
  const r = rand()
  if (r < 0.35 || notes.length === 0) {
    await d.engine.mutate('note.create', { id: randomUUID(), jobId: null, body: `note ${Math.floor(rand() * 1e6)}` })
  }
  else if (r < 0.85) {
    const n = notes[Math.floor(rand() * notes.length)]!
    const field = rand() < 0.7 ? 'body' : 'title'
    await d.engine.mutate('note.setFields', { id: n.id, fields: { [field]: `${field} ${Math.floor(rand() * 1e6)}` } }, n.version)
  }
  else if (r < 0.9) {
    const n = notes[Math.floor(rand() * notes.length)]!
    await d.engine.mutate('note.delete', { id: n.id }, n.version)
  }
  else {
    await d.engine.mutate('measurement.create', { id: randomUUID(), tool: 'idle-dissipation', inputs: IDLE_INPUTS, outputs: computeTool('idle-dissipation', IDLE_INPUTS) as Record<string, unknown>, engineVersion: ENGINE_VERSION })
  }
}

export async function runSoak(o: SoakOptions): Promise<SoakReport> {
  const rand = prng(o.seed)
  const { shopId, members } = await shopWithMembers(o.clients - 1)
  const faults = { dropRequest: 0.2, dropResponse: 0.1, duplicate: 0.1 }
  const devices = await Promise.all(members.map((http, i) => device(o.via ? o.via(http, i) : http, shopId, { faults: { ...faults }, rand: prng(o.seed * 31 + i) })))
  let restarts = 0
  const perClient = Math.ceil(o.mutations / o.clients)
  const counts = devices.map((_, i) => Math.min(perClient, o.mutations - i * perClient))

  await Promise.all(devices.map(async (d, i) => {
    for (let k = 0; k < counts[i]!; k++) {
      await randomChange(d, rand)
      if (rand() < (o.restartRate ?? 0.01)) {
        await d.restart()
        restarts++
      }
      const s = rand()
      try {
        if (s < 0.15) await d.engine.push()
        else if (s < 0.25) await d.engine.pull()
        else if (s < 0.35) await d.engine.sync()
      }
      catch { /* lost in the network: tried again later */ }
    }
  }))

  await o.beforeQuiet?.()
  // Quiet network: at most three rounds of everyone syncing.
  for (const d of devices) d.transport.faults = { ...NO_FAULTS }
  let rounds = 0
  let converged = false
  while (rounds < 3 && !converged) {
    rounds++
    for (const d of devices) await eventually(() => d.engine.push())
    for (const d of devices) await eventually(() => d.engine.pull())
    const serverNotes = await notesOf(shopId)
    converged = true
    for (const d of devices) {
      const local = new Map((await d.db.notes.where('shopId').equals(shopId).filter(n => !n.deleted).toArray()).map(n => [n.id, `${n.title}|${n.body}`]))
      if ((await d.engine.pendingCount()) > 0 || !sameMap(local, serverNotes)) converged = false
    }
  }

  const clientIds = await Promise.all(devices.map(async d => (await d.engine.meta()).clientId))
  const [logged] = await sql<{ n: number, u: number }>('select count(*) n, count(distinct uuid) u from sync_mutations where client_id in (?)', [clientIds])
  const [dups] = await sql<{ n: number }>('select count(*) - count(distinct id) n from notes where shop_id = ?', [shopId])
  const [creates] = await sql<{ n: number }>('select count(*) n from sync_mutations where client_id in (?) and name = ? and status = ?', [clientIds, 'note.create', 'applied'])
  const [onServer] = await sql<{ n: number }>('select count(*) n from notes where shop_id = ?', [shopId])
  const [conf] = await sql<{ n: number, kept: number }>(
    `select count(*) n, sum(c.client_value is not null and m.uuid is not null) kept
       from sync_conflicts c left join sync_mutations m on m.uuid = c.mutation_uuid where c.shop_id = ?`, [shopId])
  const [rej] = await sql<{ n: number }>('select count(*) n from sync_mutations where client_id in (?) and status = ?', [clientIds, 'rejected'])
  let outboxLeft = 0
  for (const d of devices) outboxLeft += await d.engine.pendingCount()
  for (const d of devices) d.db.close()
  return {
    shopId,
    mutations: o.mutations,
    loggedUuids: Number(logged!.u),
    rounds,
    converged,
    duplicateRows: Number(dups!.n),
    notesOnServer: Number(onServer!.n),
    noteCreatesApplied: Number(creates!.n),
    outboxLeft,
    conflicts: Number(conf!.n),
    conflictsWithLosingValue: Number(conf!.kept ?? 0),
    rejected: Number(rej!.n),
    restarts,
  }
}

export async function notesOf(shopId: string): Promise<Map<string, string>> {
  const rows = await sql<{ id: string, title: string, body: string }>('select id, title, body from notes where shop_id = ? and deleted_at is null', [shopId])
  return new Map(rows.map(r => [r.id, `${r.title}|${r.body}`]))
}

export function sameMap(a: Map<string, string>, b: Map<string, string>) {
  if (a.size !== b.size) return false
  for (const [k, v] of a) if (b.get(k) !== v) return false
  return true
}
