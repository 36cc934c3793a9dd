import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { SYNC_SCHEMA_VERSION } from '../../shared/utils/sync/protocol'
import { computeTool, ENGINE_VERSION } from '../../shared/utils/bench'
import { findProcedure } from '../../shared/utils/procedures/index'
import { DEMO, login, newOwner, type Client } from './helpers/client'
import { device, shopWithMembers } from './helpers/devices'
import { sql } from './helpers/db'

// Source: RCA RC-30 tube manual, 6V6GT typical operation: 285 V plate, 35 mA per tube.
const inputs = { mode: 'fixed', maxPlateWatts: 14, plateVolts: 285, method: 'direct', amps: 0.035 }
const outputs = () => computeTool('idle-dissipation', inputs) as Record<string, unknown>

interface Result { id: number, status: string, reason?: string }
async function push(c: Client, shopId: string, changes: { name: string, args: unknown, baseVersion?: number }[]): Promise<Result[]> {
  const r = await c.post('/api/sync/push', {
    clientId: randomUUID(), shopId, schemaVersion: SYNC_SCHEMA_VERSION,
    mutations: changes.map((m, i) => ({ id: i + 1, uuid: randomUUID(), ...m })),
  })
  expect(r.status, JSON.stringify(r.body)).toBe(200)
  return r.body.results
}
const statuses = (rs: Result[]) => rs.map(r => r.status)
const meOf = async (c: Client) => (await c.get('/api/auth/me')).body.user.id as string
/** The version a device would have seen: a change based on it is not a conflict. */
const seen = async (table: 'notes' | 'measurements', id: string) => Number((await sql(`select version from ${table} where id = ?`, [id]))[0].version)

describe('notes and bench results as ordinary synced records', () => {
  it('applies note.create, setFields, delete and restore with the same arguments as before, and pulls them with their author', async () => {
    const { shopId, members } = await shopWithMembers(1)
    const [owner, tech] = members as [Client, Client]
    const id = randomUUID()
    const rs = await push(tech, shopId, [
      { name: 'note.create', args: { id, jobId: null, title: 'Combo, two 6V6', body: 'Hum at idle.' } },
      { name: 'note.setFields', args: { id, fields: { body: 'Hum at idle: filter caps replaced.', visibility: 'customer' } } },
    ])
    expect(statuses(rs)).toEqual(['applied', 'applied'])
    const techId = await meOf(tech)
    const [row] = await sql('select title, body, visibility, created_by, updated_by, deleted_at from notes where id = ?', [id])
    expect(row).toMatchObject({ title: 'Combo, two 6V6', body: 'Hum at idle: filter caps replaced.', visibility: 'customer', created_by: techId, updated_by: techId, deleted_at: null })

    // The owner's device sees the note with its author, as the notebook shows it.
    const d = await device(owner, shopId)
    await d.engine.pull()
    expect(await d.db.notes.get(id)).toMatchObject({ body: 'Hum at idle: filter caps replaced.', createdBy: techId, pending: 0 })

    expect(statuses(await push(owner, shopId, [{ name: 'note.delete', args: { id }, baseVersion: await seen('notes', id) }]))).toEqual(['applied'])
    expect((await sql('select deleted_at from notes where id = ?', [id]))[0].deleted_at).not.toBeNull()
    await d.engine.pull()
    expect((await d.db.notes.get(id))!.deleted).toBe(true)
    expect(statuses(await push(owner, shopId, [{ name: 'note.restore', args: { id }, baseVersion: await seen('notes', id) }]))).toEqual(['applied'])
    await d.engine.pull()
    expect((await d.db.notes.get(id))!.deleted).toBe(false)
  })

  it('keeps a note on the job it was written for: a setFields naming another job changes only the text', async () => {
    const tech = await login(DEMO.tech)
    const [jobA, jobB] = await sql<{ id: string }>('select id from jobs where shop_id = ? and deleted_at is null order by id limit 2', [DEMO.shopId])
    const id = randomUUID()
    const rs = await push(tech, DEMO.shopId, [
      { name: 'note.create', args: { id, jobId: jobA!.id, body: 'Bias set.' } },
      { name: 'note.setFields', args: { id, fields: { body: 'Bias set to 70 %.', jobId: jobB!.id } } },
    ])
    expect(statuses(rs)).toEqual(['applied', 'applied'])
    expect((await sql('select job_id, body from notes where id = ?', [id]))[0]).toEqual({ job_id: jobA!.id, body: 'Bias set to 70 %.' })
  })

  it('lets a player change only their own notes, and staff any note of the shop', async () => {
    const dana = await login(DEMO.dana)
    const tech = await login(DEMO.tech)
    const mine = randomUUID()
    const shops = randomUUID()
    expect(statuses(await push(dana, DEMO.shopId, [{ name: 'note.create', args: { id: mine, jobId: null, body: 'Crackle on the reverb.' } }]))).toEqual(['applied'])
    expect(statuses(await push(tech, DEMO.shopId, [{ name: 'note.create', args: { id: shops, jobId: null, body: 'Shop note.' } }]))).toEqual(['applied'])

    const rs = await push(dana, DEMO.shopId, [
      { name: 'note.setFields', args: { id: shops, fields: { body: 'changed by a player' } }, baseVersion: await seen('notes', shops) },
      { name: 'note.delete', args: { id: shops }, baseVersion: await seen('notes', shops) },
      { name: 'note.setFields', args: { id: mine, fields: { body: 'Crackle on the reverb, only when warm.' } }, baseVersion: await seen('notes', mine) },
    ])
    expect(rs.map(r => [r.status, r.reason])).toEqual([
      ['rejected', 'players may change only their own notes'],
      ['rejected', 'players may change only their own notes'],
      ['applied', undefined],
    ])
    expect((await sql('select body, deleted_at from notes where id = ?', [shops]))[0]).toEqual({ body: 'Shop note.', deleted_at: null })
    expect(statuses(await push(tech, DEMO.shopId, [{ name: 'note.setFields', args: { id: mine, fields: { title: 'Reverb' } }, baseVersion: await seen('notes', mine) }]))).toEqual(['applied'])
  })

  it('takes a bench result only when the server gets the same result from its inputs, never edits one, and lets only its author or the owner delete it', async () => {
    const { shopId, members } = await shopWithMembers(2)
    const [owner, tech, tech2] = members as [Client, Client, Client]
    const good = randomUUID()
    const bad = randomUUID()
    const other = randomUUID()
    const wrong = { ...outputs(), watts: 5 }
    const rs = await push(tech, shopId, [
      { name: 'measurement.create', args: { id: good, tool: 'idle-dissipation', inputs, outputs: outputs(), engineVersion: ENGINE_VERSION, label: 'V1' } },
      { name: 'measurement.create', args: { id: bad, tool: 'idle-dissipation', inputs, outputs: wrong, engineVersion: ENGINE_VERSION } },
      { name: 'measurement.create', args: { id: other, tool: 'idle-dissipation', inputs, outputs: outputs(), engineVersion: ENGINE_VERSION } },
    ])
    expect(statuses(rs)).toEqual(['applied', 'rejected', 'applied'])
    expect(rs[1]!.reason).toMatch(/does not match its inputs/)
    expect((await sql('select tool, label, created_by from measurements where id = ?', [good]))[0]).toEqual({ tool: 'idle-dissipation', label: 'V1', created_by: await meOf(tech) })

    // There is no edit of a bench result: the change is unknown and the push asks for an update.
    const edit = await tech.post('/api/sync/push', { clientId: randomUUID(), shopId, schemaVersion: SYNC_SCHEMA_VERSION, mutations: [{ id: 1, uuid: randomUUID(), name: 'measurement.setFields', args: { id: good, fields: { label: 'V2' } } }] })
    expect(edit.status).toBe(426)

    const v = await seen('measurements', good)
    const byOther = await push(tech2, shopId, [{ name: 'measurement.delete', args: { id: good }, baseVersion: v }])
    expect(byOther.map(r => [r.status, r.reason])).toEqual([['rejected', 'only its author or the owner may delete a measurement']])
    expect(statuses(await push(tech, shopId, [{ name: 'measurement.delete', args: { id: good }, baseVersion: v }, { name: 'measurement.restore', args: { id: good }, baseVersion: v }]))).toEqual(['applied', 'applied'])
    expect(statuses(await push(owner, shopId, [{ name: 'measurement.delete', args: { id: other }, baseVersion: await seen('measurements', other) }]))).toEqual(['applied'])
    const rows = await sql<{ id: string, deleted_at: Date | null }>('select id, deleted_at from measurements where id in (?, ?)', [good, other])
    expect(Object.fromEntries(rows.map(r => [r.id, r.deleted_at === null]))).toEqual({ [good]: true, [other]: false })
  })

  it('turns a note\'s text edited on two devices into a conflict, which a decision resolves on both', async () => {
    const { shopId, members } = await shopWithMembers(1)
    const a = await device(members[0]!, shopId)
    const b = await device(members[1]!, shopId)
    const id = randomUUID()
    await a.engine.mutate('note.create', { id, jobId: null, title: 'Head, four EL34', body: 'Plate 440 V.' })
    await a.engine.sync()
    await b.engine.pull()
    const base = (await b.db.notes.get(id))!.version
    await a.engine.mutate('note.setFields', { id, fields: { body: 'Plate 440 V, screen 430 V.' } }, base)
    await b.engine.mutate('note.setFields', { id, fields: { body: 'Plate 445 V.' } }, base)
    expect((await a.engine.push()).results.map(r => r.status)).toEqual(['applied'])
    expect((await b.engine.push()).results.map(r => r.status)).toEqual(['conflict'])
    await b.engine.pull()
    const [conflict] = await b.db.conflicts.where('rowId').equals(id).toArray()
    expect(conflict).toMatchObject({ tableName: 'notes', field: 'body', status: 'open', serverValue: 'Plate 440 V, screen 430 V.', clientValue: 'Plate 445 V.' })
    // Until someone decides, the server keeps the first text.
    expect((await sql('select body from notes where id = ?', [id]))[0].body).toBe('Plate 440 V, screen 430 V.')

    await b.engine.mutate('conflict.resolve', { id: conflict!.id, value: 'Plate 445 V, screen 430 V (re-measured).' })
    expect((await b.engine.push()).results.map(r => r.status)).toEqual(['applied'])
    await a.engine.pull()
    await b.engine.pull()
    for (const d of [a, b]) {
      expect((await d.db.notes.get(id))!.body).toBe('Plate 445 V, screen 430 V (re-measured).')
      expect((await d.db.conflicts.get(conflict!.id))!.status).toBe('resolved')
    }
  })

  it('refuses a note, a bench result and a procedure reading that point at another shop\'s job or result', async () => {
    const [job] = await sql<{ id: string }>('select id from jobs where shop_id = ? and deleted_at is null limit 1', [DEMO.shopId])
    const tech = await login(DEMO.tech)
    const theirs = randomUUID()
    expect(statuses(await push(tech, DEMO.shopId, [{ name: 'measurement.create', args: { id: theirs, tool: 'idle-dissipation', inputs, outputs: outputs(), engineVersion: ENGINE_VERSION } }]))).toEqual(['applied'])

    const other = await newOwner('records-foreign')
    const note = randomUUID()
    const measurement = randomUUID()
    const rs = await push(other.c, other.shopId, [
      { name: 'note.create', args: { id: note, jobId: job!.id, body: 'on your job', visibility: 'customer' } },
      { name: 'measurement.create', args: { id: measurement, tool: 'idle-dissipation', inputs, outputs: outputs(), engineVersion: ENGINE_VERSION, jobId: job!.id } },
    ])
    expect(rs.map(r => [r.status, r.reason])).toEqual([['rejected', 'job not found in this shop'], ['rejected', 'job not found in this shop']])
    expect(await sql('select id from notes where id = ?', [note])).toHaveLength(0)
    expect(await sql('select id from measurements where id = ?', [measurement])).toHaveLength(0)

    // A procedure run's reading may name only a bench result of its own shop.
    const procedureId = 'drain-and-verify-caps'
    const runId = randomUUID()
    const gate = { id: randomUUID(), runId, procedureId, jobId: null, items: findProcedure(procedureId)!.gate.map(g => g.id), acknowledgedAt: new Date().toISOString() }
    expect((await other.c.post('/api/procedure-gates', gate)).status).toBe(201)
    expect((await other.c.post('/api/procedure-runs', { id: runId, procedureId, gateId: gate.id, jobId: null })).status).toBe(201)
    const at = new Date().toISOString()
    const foreign = await other.c.patch(`/api/procedure-runs/${runId}`, { readings: { idle: { measurementId: theirs, at } } })
    expect(foreign.status).toBe(404)
    expect(foreign.body.message).toBe('Measurement not found in this shop.')
    const own = randomUUID()
    expect(statuses(await push(other.c, other.shopId, [{ name: 'measurement.create', args: { id: own, tool: 'idle-dissipation', inputs, outputs: outputs(), engineVersion: ENGINE_VERSION } }]))).toEqual(['applied'])
    const ok = await other.c.patch(`/api/procedure-runs/${runId}`, { readings: { idle: { measurementId: own, at } } })
    expect(ok.status, JSON.stringify(ok.body)).toBe(200)
    expect(ok.body.readings.idle.measurementId).toBe(own)
  })
})
