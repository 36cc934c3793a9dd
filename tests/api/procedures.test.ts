import { randomUUID } from 'node:crypto'
import { beforeAll, describe, expect, it } from 'vitest'
import { expandSteps, findProcedure, needsValue, type StepReading } from '../../shared/utils/procedures/index'
import { DEMO, login, type Client } from './helpers/client'
import { device, shopWithMembers } from './helpers/devices'

const at = () => new Date().toISOString()
const itemsOf = (procedureId: string) => findProcedure(procedureId)!.gate.map(g => g.id)
const gateFor = (procedureId: string, runId: string, extra: Record<string, unknown> = {}) =>
  ({ id: randomUUID(), runId, procedureId, jobId: null, items: itemsOf(procedureId), acknowledgedAt: at(), ...extra })
const runFor = (procedureId: string, runId: string, gateId: string, extra: Record<string, unknown> = {}) =>
  ({ id: runId, procedureId, gateId, jobId: null, capCount: 3, ...extra })

/** A gate and its run through REST; returns the run id. */
async function startRun(c: Client, procedureId: string, extra: Record<string, unknown> = {}) {
  const runId = randomUUID()
  const gate = gateFor(procedureId, runId, extra)
  const g = await c.post('/api/procedure-gates', gate)
  expect(g.status, JSON.stringify(g.body)).toBe(201)
  const r = await c.post('/api/procedure-runs', runFor(procedureId, runId, gate.id, extra))
  expect(r.status, JSON.stringify(r.body)).toBe(201)
  return runId
}

function capReadings(volts: number): Record<string, StepReading> {
  const caps = findProcedure('drain-and-verify-caps')!
  const steps = expandSteps(caps, '', { tubes: 2, caps: 3 })
  return Object.fromEntries(steps.map(s => [s.key, needsValue(s) ? { value: s.key === 'drain-time' ? 48.3 : volts, at: at() } : { at: at() }]))
}

let owner: Client
let tech: Client
let tech2: Client
beforeAll(async () => {
  const shop = await shopWithMembers(2)
  ;[owner, tech, tech2] = shop.members as [Client, Client, Client]
})

describe('procedure runs need their safety check', () => {
  it('refuses a run with no check, or with a check for another run, procedure or person (400)', async () => {
    const runId = randomUUID()
    const none = await tech.post('/api/procedure-runs', runFor('set-fixed-bias', runId, randomUUID()))
    expect(none.status).toBe(400)
    expect(none.body.message).toMatch(/needs its own acknowledged safety check/i)

    const otherRun = gateFor('set-fixed-bias', randomUUID())
    expect((await tech.post('/api/procedure-gates', otherRun)).status).toBe(201)
    expect((await tech.post('/api/procedure-runs', runFor('set-fixed-bias', runId, otherRun.id))).status).toBe(400)

    const otherProcedure = gateFor('check-cathode-bias', runId)
    expect((await tech.post('/api/procedure-gates', otherProcedure)).status).toBe(201)
    expect((await tech.post('/api/procedure-runs', runFor('set-fixed-bias', runId, otherProcedure.id))).status).toBe(400)

    const byOwner = gateFor('set-fixed-bias', runId)
    expect((await owner.post('/api/procedure-gates', byOwner)).status).toBe(201)
    expect((await tech.post('/api/procedure-runs', runFor('set-fixed-bias', runId, byOwner.id))).status).toBe(400)
    expect((await tech.get(`/api/procedure-runs/${runId}`)).status).toBe(404)
  })

  it('refuses a check with an item left unticked, or one that is not its own (400)', async () => {
    const short = gateFor('drain-and-verify-caps', randomUUID(), { items: itemsOf('drain-and-verify-caps').slice(1) })
    const r = await tech.post('/api/procedure-gates', short)
    expect(r.status).toBe(400)
    expect(r.body.message).toMatch(/every item of the Drain and verify filter capacitors safety check must be ticked/i)
    const foreign = gateFor('drain-and-verify-caps', randomUUID(), { items: [...itemsOf('drain-and-verify-caps'), 'never-open'] })
    expect((await tech.post('/api/procedure-gates', foreign)).status).toBe(400)
    const unknown = { ...gateFor('backstage-check', randomUUID()), procedureId: 'no-such-procedure' }
    expect((await tech.post('/api/procedure-gates', unknown)).body.message).toMatch(/no such procedure/i)
  })

  it('takes a check and its run, and shows who acknowledged it and when', async () => {
    const runId = await startRun(tech, 'set-fixed-bias', { variant: 'transformer-resistance' })
    const r = await tech.get(`/api/procedure-runs/${runId}`)
    expect(r.status).toBe(200)
    expect(r.body).toMatchObject({ id: runId, status: 'running', variant: 'transformer-resistance', stepIndex: 0 })
    expect(r.body.gate.items).toEqual(itemsOf('set-fixed-bias'))
    expect(r.body.gate.createdByName).toMatch(/^Member /)
    expect(Date.parse(r.body.gate.acknowledgedAt)).not.toBeNaN()
    const list = await owner.get('/api/procedure-runs')
    expect(list.body.items.map((x: { id: string }) => x.id)).toContain(runId)
    expect((await tech.post('/api/procedure-runs', runFor('set-fixed-bias', randomUUID(), r.body.gate.id, { variant: 'shunt' }))).status).toBe(400)
  })

  it('takes a check and its run made offline in one push, and another device pulls both', async () => {
    const me = (await tech.get('/api/auth/me')).body
    const phone = await device(tech, me.activeShop.id)
    const runId = randomUUID()
    const gate = gateFor('drain-and-verify-caps', runId)
    await phone.engine.mutate('procedureGate.create', gate)
    await phone.engine.mutate('procedureRun.create', runFor('drain-and-verify-caps', runId, gate.id))
    const orphan = randomUUID()
    await phone.engine.mutate('procedureRun.create', runFor('drain-and-verify-caps', orphan, randomUUID()))
    const r = await phone.engine.push()
    expect(r.results.map(x => x.status)).toEqual(['applied', 'applied', 'rejected'])
    expect(r.results[2]!.reason).toMatch(/needs its own acknowledged safety check/)

    const desk = await device(owner, me.activeShop.id)
    await desk.engine.pull()
    expect((await desk.db.procedureGates.get(gate.id))?.runId).toBe(runId)
    expect((await desk.db.procedureRuns.get(runId))?.gateId).toBe(gate.id)
    expect(await desk.db.procedureRuns.get(orphan)).toBeUndefined()

    // A check is never rewritten, by anyone.
    await desk.engine.mutate('procedureGate.setFields', { id: gate.id, fields: { items: ['one-hand'] } }, (await desk.db.procedureGates.get(gate.id))!.version)
    const edit = await desk.engine.push()
    expect(edit.results[0]!.status).toBe('rejected')
    expect(edit.results[0]!.reason).toMatch(/may not change procedureGates/)
  })
})

describe('who may run what', () => {
  it('a player may not acknowledge or run a procedure inside the chassis (403), but may run the backstage check', async () => {
    const sam = await login(DEMO.sam)
    const runId = randomUUID()
    const gate = await sam.post('/api/procedure-gates', gateFor('set-fixed-bias', runId))
    expect(gate.status).toBe(403)
    expect(gate.body.message).toMatch(/inside the chassis are for qualified people/i)
    const run = await sam.post('/api/procedure-runs', runFor('drain-and-verify-caps', runId, randomUUID()))
    expect(run.status).toBe(403)
    const mine = await startRun(sam, 'backstage-check')
    expect((await sam.get(`/api/procedure-runs/${mine}`)).body.status).toBe('running')
  })

  it('desk runs no procedures (403)', async () => {
    const desk = await login(DEMO.desk)
    expect((await desk.post('/api/procedure-gates', gateFor('backstage-check', randomUUID()))).status).toBe(403)
    expect((await desk.post('/api/procedure-runs', runFor('backstage-check', randomUUID(), randomUUID()))).status).toBe(403)
  })

  it('a player sees their own runs, not the shop\'s', async () => {
    const shopTech = await login(DEMO.tech)
    const shopRun = await startRun(shopTech, 'clean-power-run')
    const sam = await login(DEMO.sam)
    const samRun = await startRun(sam, 'backstage-check')
    const list = (await sam.get('/api/procedure-runs?pageSize=100')).body.items.map((x: { id: string }) => x.id)
    expect(list).toContain(samRun)
    expect(list).not.toContain(shopRun)
    expect((await sam.get(`/api/procedure-runs/${shopRun}`)).status).toBe(404)
    const phone = await device(sam, DEMO.shopId)
    await phone.engine.pull()
    expect(await phone.db.procedureRuns.get(samRun)).toBeDefined()
    expect(await phone.db.procedureRuns.get(shopRun)).toBeUndefined()
  })

  it('only the person running it, or an owner, changes a run (403)', async () => {
    const runId = await startRun(tech, 'drain-and-verify-caps')
    const other = await tech2.patch(`/api/procedure-runs/${runId}`, { stepIndex: 2 })
    expect(other.status).toBe(403)
    expect((await tech.patch(`/api/procedure-runs/${runId}`, { stepIndex: 2 })).body.stepIndex).toBe(2)
    expect((await owner.patch(`/api/procedure-runs/${runId}`, { stepIndex: 3 })).body.stepIndex).toBe(3)
    expect((await tech.patch(`/api/procedure-runs/${runId}`, { procedureId: 'clean-power-run' })).status).toBe(400)
  })
})

describe('finishing a run', () => {
  it('a capacitor above 50 V blocks done; with every capacitor at or below 50 V it finishes, and stays finished', async () => {
    const runId = await startRun(tech, 'drain-and-verify-caps')
    // Source: the shop's rule that a reading above 50 V on any capacitor blocks "done".
    const hot = { ...capReadings(3), 'verify:2': { value: 51, at: at() } }
    const r = await tech.patch(`/api/procedure-runs/${runId}`, { readings: hot, status: 'done' })
    expect(r.status).toBe(400)
    expect(r.body.message).toMatch(/out of range \(verify:2\)/i)
    expect((await tech.get(`/api/procedure-runs/${runId}`)).body.status).toBe('running')

    const { recheck: _r, ...unfinished } = capReadings(3)
    const missing = await tech.patch(`/api/procedure-runs/${runId}`, { readings: unfinished, status: 'done' })
    expect(missing.status).toBe(400)
    expect(missing.body.message).toMatch(/steps still to do: recheck/i)

    const done = await tech.patch(`/api/procedure-runs/${runId}`, { readings: capReadings(50), status: 'done', endedAt: at() })
    expect(done.status).toBe(200)
    expect(done.body.status).toBe('done')
    expect((await tech.patch(`/api/procedure-runs/${runId}`, { status: 'running' })).status).toBe(400)
  })

  it('a run may be ended early as stopped, with its reason', async () => {
    const runId = await startRun(tech, 'set-fixed-bias')
    const r = await tech.patch(`/api/procedure-runs/${runId}`, { status: 'stopped', endedAt: at(), endReason: 'Bias will not come into range: bias supply suspect' })
    expect(r.status).toBe(200)
    expect(r.body).toMatchObject({ status: 'stopped', endReason: 'Bias will not come into range: bias supply suspect' })
  })

  it('refuses a check on a job this shop does not have, and a player attaching a run to a job (403)', async () => {
    const runId = randomUUID()
    const gate = gateFor('check-cathode-bias', runId, { jobId: randomUUID() })
    const r = await tech.post('/api/procedure-gates', gate)
    expect(r.status).toBe(404)
    expect(r.body.message).toMatch(/job not found in this shop/i)
    const sam = await login(DEMO.sam)
    expect((await sam.post('/api/procedure-gates', gateFor('backstage-check', randomUUID(), { jobId: randomUUID() }))).status).toBe(403)
  })
})
