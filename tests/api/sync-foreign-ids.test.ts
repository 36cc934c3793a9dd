import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { SYNC_SCHEMA_VERSION } from '../../shared/utils/sync/protocol'
import { computeTool, ENGINE_VERSION } from '../../shared/utils/bench'
import { findProcedure } from '../../shared/utils/procedures/index'
import { DEMO, login, newOwner } from './helpers/client'
import { device } from './helpers/devices'
import { sql } from './helpers/db'

// Source: RCA RC-30 tube manual, 6V6GT typical operation: 285 V, 35 mA per tube.
const inputs = { mode: 'fixed', maxPlateWatts: 14, plateVolts: 285, method: 'direct', amps: 0.035 }

async function demoJobAndAmp() {
  const [job] = await sql<{ id: string, amp_id: string }>('select id, amp_id from jobs where shop_id = ? and deleted_at is null limit 1', [DEMO.shopId])
  return job!
}

describe('records that point at another shop', () => {
  it('refuses a note and a measurement naming another shop\'s job or amp, writes nothing, and the shop never sees them', async () => {
    const job = await demoJobAndAmp()
    const other = await newOwner('foreign')
    const outputs = computeTool('idle-dissipation', inputs) as Record<string, unknown>
    const noteId = randomUUID()
    const measurementIds = [randomUUID(), randomUUID()]
    const mutations = [
      { id: 1, uuid: randomUUID(), name: 'note.create', args: { id: noteId, jobId: job.id, body: 'planted on your job' } },
      { id: 2, uuid: randomUUID(), name: 'measurement.create', args: { id: measurementIds[0], tool: 'idle-dissipation', inputs, outputs, engineVersion: ENGINE_VERSION, jobId: job.id } },
      { id: 3, uuid: randomUUID(), name: 'measurement.create', args: { id: measurementIds[1], tool: 'idle-dissipation', inputs, outputs, engineVersion: ENGINE_VERSION, rigId: job.amp_id } },
    ]
    const r = await other.c.post('/api/sync/push', { clientId: randomUUID(), shopId: other.shopId, schemaVersion: SYNC_SCHEMA_VERSION, mutations })
    expect(r.status).toBe(200)
    expect(r.body.results.map((x: { status: string }) => x.status)).toEqual(['rejected', 'rejected', 'rejected'])
    expect(r.body.results[0].reason).toBe('job not found in this shop')
    expect(r.body.results[1].reason).toBe('job not found in this shop')
    expect(r.body.results[2].reason).toBe('rig not found')
    expect(await sql('select id from notes where id = ?', [noteId])).toHaveLength(0)
    expect(await sql('select id from measurements where id in (?, ?)', measurementIds)).toHaveLength(0)

    const tech = await device(await login(DEMO.tech), DEMO.shopId)
    await tech.engine.pull()
    expect(await tech.db.notes.get(noteId)).toBeUndefined()
    expect(await tech.db.measurements.where('jobId').equals(job.id).filter(m => measurementIds.includes(m.id)).count()).toBe(0)
  })

  it('still accepts a note and a measurement on the shop\'s own job', async () => {
    const job = await demoJobAndAmp()
    const tech = await login(DEMO.tech)
    const outputs = computeTool('idle-dissipation', inputs) as Record<string, unknown>
    const noteId = randomUUID()
    const measurementId = randomUUID()
    const r = await tech.post('/api/sync/push', { clientId: randomUUID(), shopId: DEMO.shopId, schemaVersion: SYNC_SCHEMA_VERSION, mutations: [
      { id: 1, uuid: randomUUID(), name: 'note.create', args: { id: noteId, jobId: job.id, body: 'bias checked' } },
      { id: 2, uuid: randomUUID(), name: 'measurement.create', args: { id: measurementId, tool: 'idle-dissipation', inputs, outputs, engineVersion: ENGINE_VERSION, jobId: job.id } },
    ] })
    expect(r.body.results.map((x: { status: string }) => x.status)).toEqual(['applied', 'applied'])
    expect(await sql('select id from notes where id = ? and job_id = ?', [noteId, job.id])).toHaveLength(1)
  })

  it('refuses a safety check naming another shop\'s run or job, and takes one for a run still to start', async () => {
    const [run] = await sql<{ id: string }>('select id from procedure_runs where shop_id = ? limit 1', [DEMO.shopId])
    const job = await demoJobAndAmp()
    const other = await newOwner('foreign-gate')
    const procedureId = 'drain-and-verify-caps'
    const gate = (runId: string, jobId: string | null) => ({ id: randomUUID(), runId, procedureId, jobId, items: findProcedure(procedureId)!.gate.map(g => g.id), acknowledgedAt: new Date().toISOString() })
    const r = await other.c.post('/api/sync/push', { clientId: randomUUID(), shopId: other.shopId, schemaVersion: SYNC_SCHEMA_VERSION, mutations: [
      { id: 1, uuid: randomUUID(), name: 'procedureGate.create', args: gate(run!.id, null) },
      { id: 2, uuid: randomUUID(), name: 'procedureGate.create', args: gate(randomUUID(), job.id) },
      { id: 3, uuid: randomUUID(), name: 'procedureGate.create', args: gate(randomUUID(), null) },
    ] })
    expect(r.body.results.map((x: { status: string }) => x.status)).toEqual(['rejected', 'rejected', 'applied'])
    expect(r.body.results[0].reason).toBe('run not found in this shop')
    expect(r.body.results[1].reason).toBe('job not found in this shop')
  })
})
