import { randomUUID } from 'node:crypto'
import { beforeAll, describe, expect, it } from 'vitest'
import { SYNC_SCHEMA_VERSION } from '../../shared/utils/sync/protocol'
import { client, DEMO, login, newOwner, type Client } from './helpers/client'
import { sql } from './helpers/db'
import { pushFromDevice, statuses } from './helpers/push'

let owner: Client, tech: Client, desk: Client, dana: Client, sam: Client
let other: Awaited<ReturnType<typeof newOwner>>
const tag = () => randomUUID().slice(0, 8)

beforeAll(async () => {
  [owner, tech, desk, dana, sam] = await Promise.all([DEMO.owner, DEMO.tech, DEMO.desk, DEMO.dana, DEMO.sam].map(e => login(e)))
  other = await newOwner('jobs-elsewhere')
})

/** A customer, amp and checked-in job made by the desk through REST. */
async function checkIn(by: Client = desk, extra: Record<string, unknown> = {}) {
  const t = tag()
  const customer = await by.post('/api/customers', { name: `Customer ${t}`, email: `c-${t}@test.example` })
  expect(customer.status).toBe(201)
  const amp = await by.post('/api/amps', { customerId: customer.body.id, description: 'two-6V6 combo, fixed bias', serial: `TST-${t}` })
  expect(amp.status).toBe(201)
  const job = await by.post('/api/jobs', { customerId: customer.body.id, ampId: amp.body.id, complaint: `Hum at idle ${t}`, ...extra })
  expect(job.status).toBe(201)
  return { t, customer: customer.body, amp: amp.body, job: job.body }
}

describe('jobs over REST', () => {
  it('desk checks a job in; it starts checked in, stamped with a shop version and a timeline event', async () => {
    const { job, customer } = await checkIn()
    expect(job).toMatchObject({ status: 'checked-in', priority: 'normal', customerId: customer.id })
    expect(job.version).toBeGreaterThan(0)
    expect(job.fieldStamps).toBeUndefined()
    const detail = await tech.get(`/api/jobs/${job.id}`)
    expect(detail.status).toBe(200)
    expect(detail.body.customer.name).toBe(customer.name)
    expect(detail.body.amp.description).toBe('two-6V6 combo, fixed bias')
    expect(detail.body.events.map((e: { toStatus: string }) => e.toStatus)).toEqual(['checked-in'])
    for (const k of ['parts', 'labour', 'notes', 'measurements', 'invoices']) expect(detail.body[k]).toEqual([])
    // No client log for REST edits.
    const logged = await sql('select count(*) n from sync_mutations where client_id = ?', ['server-direct'])
    expect(Number(logged[0].n)).toBe(0)
  })

  it('moves along the status flow and refuses impossible moves with 400', async () => {
    const { job } = await checkIn()
    const bad = await tech.patch(`/api/jobs/${job.id}`, { status: 'closed' })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/cannot go from Checked in to Closed/)
    const ok = await tech.patch(`/api/jobs/${job.id}`, { status: 'on-bench', assignedTo: (await tech.get('/api/auth/me')).body.user.id })
    expect(ok.status).toBe(200)
    expect(ok.body.status).toBe('on-bench')
    expect(ok.body.version).toBeGreaterThan(job.version)
    const back = await tech.patch(`/api/jobs/${job.id}`, { status: 'handed-back' })
    expect(back.status).toBe(400)
    const events = await sql<{ from_status: string | null, to_status: string }>('select from_status, to_status from job_events where job_id = ? order by version', [job.id])
    expect(events).toEqual([{ from_status: null, to_status: 'checked-in' }, { from_status: 'checked-in', to_status: 'on-bench' }])
  })

  it('a REST edit is seen by a device that pulls, and a stale device edit of the same field becomes a conflict', async () => {
    const { job } = await checkIn()
    await desk.patch(`/api/jobs/${job.id}`, { complaint: 'Changed at the desk' })
    const body = {
      clientId: randomUUID(), shopId: DEMO.shopId, schemaVersion: SYNC_SCHEMA_VERSION,
      mutations: [{ id: 1, uuid: randomUUID(), name: 'job.setFields', args: { id: job.id, fields: { complaint: 'Changed on a phone' } }, baseVersion: job.version }],
    }
    const r = await tech.post('/api/sync/push', body)
    expect(r.body.results[0].status).toBe('conflict')
    expect((await tech.get(`/api/jobs/${job.id}`)).body.complaint).toBe('Changed at the desk')
    // Decide it, so the demo shop is left with no open conflict for later suites.
    const [c] = await sql<{ id: string }>('select id from sync_conflicts where row_id = ? and status = ?', [job.id, 'open'])
    const resolved = await tech.post('/api/sync/push', { ...body, mutations: [{ id: 2, uuid: randomUUID(), name: 'conflict.resolve', args: { id: c!.id, value: 'Changed at the desk' } }] })
    expect(resolved.body.results[0].status).toBe('applied')
  })

  it('answers 400 with a message for bad input (404 for an id that is no record of the shop), never 500', async () => {
    const { job } = await checkIn()
    const cases: [Client, string, string, unknown?, number?][] = [
      [desk, 'POST', '/api/jobs', {}],
      [desk, 'POST', '/api/jobs', { customerId: 'nope', ampId: randomUUID(), complaint: 'x' }],
      [desk, 'POST', '/api/jobs', { customerId: randomUUID(), ampId: randomUUID(), complaint: 'points nowhere' }, 404],
      [desk, 'POST', '/api/jobs', { ...job, id: undefined, status: 'ready' }],
      [tech, 'PATCH', `/api/jobs/${job.id}`, {}],
      [tech, 'PATCH', `/api/jobs/${job.id}`, { status: 'bogus' }],
      [tech, 'PATCH', `/api/jobs/${job.id}`, { promisedFor: 'next tuesday' }],
      [tech, 'GET', '/api/jobs?pageSize=500'],
      [tech, 'GET', '/api/jobs?status=on-bench,sideways'],
      [tech, 'GET', '/api/jobs?sort=colour'],
      [tech, 'GET', '/api/jobs/not-an-id'],
      [desk, 'POST', '/api/customers', { name: '' }],
      [desk, 'POST', '/api/customers', { name: 'X', email: 'not-mail' }],
      [tech, 'POST', '/api/amps', { customerId: randomUUID(), description: 'orphan' }, 404],
      [owner, 'PATCH', '/api/shop/settings', { currency: 'dollars' }],
      [owner, 'PATCH', '/api/shop/settings', { taxRateBasisPoints: 8.25 }],
    ]
    for (const [c, method, path, body, status] of cases) {
      const r = await c.raw(method, path, body)
      expect(r.status, `${method} ${path} ${JSON.stringify(body)}`).toBe(status ?? 400)
      expect(typeof r.body.message).toBe('string')
      expect(JSON.stringify(r.body)).not.toMatch(/stack|sql|at Object/i)
    }
  })

  it('lists with filters, search, sort, pages and status counts', async () => {
    const a = await checkIn(desk, { priority: 'rush' })
    const b = await checkIn(desk, { priority: 'low' })
    await tech.patch(`/api/jobs/${b.job.id}`, { status: 'on-bench' })
    const bySerial = await tech.get(`/api/jobs?q=TST-${a.t}`)
    expect(bySerial.body.items.map((j: { id: string }) => j.id)).toEqual([a.job.id])
    expect(bySerial.body.total).toBe(1)
    expect(bySerial.body.items[0]).toMatchObject({ ampSerial: `TST-${a.t}`, customerName: a.customer.name })
    const byName = await tech.get(`/api/jobs?q=${encodeURIComponent(b.customer.name)}`)
    expect(byName.body.items.map((j: { id: string }) => j.id)).toEqual([b.job.id])
    const byComplaint = await tech.get(`/api/jobs?q=${encodeURIComponent(`idle ${a.t}`)}`)
    expect(byComplaint.body.total).toBe(1)
    // Literal % matches nothing rather than everything.
    expect((await tech.get('/api/jobs?q=%25%25%25')).body.total).toBe(0)

    const mine = await tech.get(`/api/jobs?customer=${b.customer.id}&status=on-bench`)
    expect(mine.body.items.map((j: { id: string }) => j.id)).toEqual([b.job.id])
    expect(mine.body.counts).toEqual({ 'on-bench': 1 })
    expect((await tech.get(`/api/jobs?customer=${b.customer.id}&status=checked-in,ready`)).body.total).toBe(0)

    const all = await owner.get('/api/jobs?status=checked-in&sort=priority&dir=desc&pageSize=100')
    const priorities = all.body.items.map((j: { priority: string }) => ['low', 'normal', 'rush'].indexOf(j.priority))
    expect(priorities).toEqual([...priorities].sort((x: number, y: number) => y - x))
    const p1 = await owner.get('/api/jobs?pageSize=2&page=1&sort=updatedAt')
    const p2 = await owner.get('/api/jobs?pageSize=2&page=2&sort=updatedAt')
    expect(p1.body.items).toHaveLength(2)
    expect(p1.body.total).toBe(p2.body.total)
    expect(p1.body.items.map((j: { id: string }) => j.id)).not.toContain(p2.body.items[0].id)
    const sum = Object.values(p1.body.counts as Record<string, number>).reduce((s, n) => s + n, 0)
    expect(sum).toBe(p1.body.total)
  })

  it('the same list asked again shows every change made in between, over REST or from a device', async () => {
    const { t, customer, job } = await checkIn()
    const list = async () => (await tech.get(`/api/jobs?q=${encodeURIComponent(`idle ${t}`)}&sort=promisedFor&dir=asc`)).body
    expect((await list()).items).toMatchObject([{ id: job.id, status: 'checked-in', customerName: customer.name }])
    expect(await list()).toEqual(await list())

    await tech.patch(`/api/jobs/${job.id}`, { status: 'on-bench' })
    expect((await list()).items[0].status).toBe('on-bench')
    // A change to another record the row shows: the customer's name.
    await desk.patch(`/api/customers/${customer.id}`, { name: `Renamed ${t}` })
    expect((await list()).items[0].customerName).toBe(`Renamed ${t}`)
    const fresh = (await tech.get(`/api/jobs/${job.id}`)).body
    const pushed = await pushFromDevice(tech, DEMO.shopId, [{ name: 'job.setFields', args: { id: job.id, fields: { status: 'soak' } }, baseVersion: fresh.version }])
    expect(statuses(pushed.body.results)).toEqual(['applied'])
    expect((await list())).toMatchObject({ total: 1, counts: { soak: 1 }, items: [{ status: 'soak' }] })
    expect((await owner.del(`/api/jobs/${job.id}`)).status).toBe(200)
    expect(await list()).toMatchObject({ total: 0, items: [] })
  })

  it('shows the seeded week of demo jobs, one in every state, and each player only their own', async () => {
    const all = await owner.get('/api/jobs?pageSize=100')
    for (const s of ['checked-in', 'on-bench', 'waiting-parts', 'soak', 'ready', 'handed-back', 'closed', 'cancelled']) {
      expect(all.body.counts[s], s).toBeGreaterThanOrEqual(1)
    }
    const danaJobs = await dana.get('/api/jobs?pageSize=100')
    expect(danaJobs.status).toBe(200)
    expect(danaJobs.body.items.length).toBeGreaterThanOrEqual(1)
    expect(new Set(danaJobs.body.items.map((j: { customerName: string }) => j.customerName))).toEqual(new Set(['Dana Whitlow']))
    const ready = danaJobs.body.items.find((j: { ampSerial: string }) => j.ampSerial === 'LAW-0412')
    expect(ready.status).toBe('ready')
    const detail = await dana.get(`/api/jobs/${ready.id}`)
    expect(detail.status).toBe(200)
    expect(detail.body.invoices.some((i: { state: string }) => i.state === 'sent')).toBe(true)
    expect(detail.body.events.map((e: { toStatus: string }) => e.toStatus)).toEqual(['checked-in', 'on-bench', 'soak', 'ready'])
    // Sam may not open Dana's job.
    expect((await sam.get(`/api/jobs/${ready.id}`)).status).toBe(404)
    expect((await sam.get('/api/jobs?q=LAW-0412')).body.total).toBe(0)
    const settings = await desk.get('/api/shop/settings')
    expect(settings.body).toEqual({
      name: 'Larkspur Amp Works', address: 'Unit 3, 18 Kiln Row', phone: '555-0100', email: 'desk@larkspur.example',
      labourRateCents: 9000, taxRateBasisPoints: 825, currency: 'usd', readyEmail: true, invoiceEmail: true, paymentEmail: true,
    })
    // A player reads the shop's contact and billing rules, not its e-mail switches.
    const forDana = (await dana.get('/api/shop/settings')).body
    expect(forDana).toMatchObject({ name: 'Larkspur Amp Works', taxRateBasisPoints: 825, currency: 'usd' })
    expect(Object.keys(forDana)).not.toContain('readyEmail')
    expect(Object.keys(forDana)).not.toContain('invoiceEmail')
  })

  it('lets each role do only its part (allowed 2xx, others 403)', async () => {
    const { job, customer, amp } = await checkIn()
    const expectStatus = async (c: Client, method: string, path: string, status: number, body?: unknown) => {
      const r = await c.raw(method, path, body)
      expect(r.status, `${method} ${path}`).toBe(status)
      return r
    }
    const newJob = () => ({ customerId: customer.id, ampId: amp.id, complaint: `Another look ${tag()}` })
    await expectStatus(owner, 'POST', '/api/jobs', 201, newJob())
    await expectStatus(tech, 'POST', '/api/jobs', 403, newJob())
    await expectStatus(dana, 'POST', '/api/jobs', 403, newJob())
    for (const c of [owner, tech, desk]) await expectStatus(c, 'GET', `/api/jobs/${job.id}`, 200)
    await expectStatus(dana, 'GET', `/api/jobs/${job.id}`, 404)
    for (const c of [owner, tech, desk]) await expectStatus(c, 'PATCH', `/api/jobs/${job.id}`, 200, { accessories: `cover ${tag()}` })
    await expectStatus(dana, 'PATCH', `/api/jobs/${job.id}`, 403, { accessories: 'mine' })
    for (const c of [tech, desk, dana]) await expectStatus(c, 'DELETE', `/api/jobs/${job.id}`, 403)

    for (const c of [owner, tech, desk]) {
      await expectStatus(c, 'GET', '/api/customers?q=Customer', 200)
      await expectStatus(c, 'GET', `/api/customers/${customer.id}`, 200)
      await expectStatus(c, 'GET', `/api/amps/${amp.id}`, 200)
    }
    for (const p of ['/api/customers', `/api/customers/${customer.id}`, '/api/amps', `/api/amps/${amp.id}`, '/api/mail']) {
      await expectStatus(dana, 'GET', p, 403)
    }
    // A player reads the billing settings their totals are worked out with, not the shop's internal switches.
    const billing = (await dana.get('/api/shop/settings')).body
    expect(billing).toHaveProperty('taxRateBasisPoints')
    expect(billing).not.toHaveProperty('readyEmail')
    await expectStatus(owner, 'POST', '/api/customers', 201, { name: `Walk-in ${tag()}` })
    for (const c of [tech, dana]) await expectStatus(c, 'POST', '/api/customers', 403, { name: 'Nope' })
    await expectStatus(desk, 'PATCH', `/api/customers/${customer.id}`, 200, { phone: '555-0100' })
    await expectStatus(tech, 'PATCH', `/api/customers/${customer.id}`, 403, { phone: '555-0101' })
    await expectStatus(tech, 'POST', '/api/amps', 201, { customerId: customer.id, description: '100 W four-6L6 head', serial: `TST-${tag()}` })
    await expectStatus(dana, 'POST', '/api/amps', 403, { customerId: customer.id, description: 'x' })
    await expectStatus(tech, 'PATCH', `/api/amps/${amp.id}`, 200, { tubeComplement: '2 x 6V6GT' })
    await expectStatus(dana, 'PATCH', `/api/amps/${amp.id}`, 403, { serial: 'x' })
    for (const c of [tech, desk]) {
      await expectStatus(c, 'DELETE', `/api/amps/${amp.id}`, 403)
      await expectStatus(c, 'DELETE', `/api/customers/${customer.id}`, 403)
    }
    await expectStatus(desk, 'PATCH', '/api/shop/settings', 403, { readyEmail: false })
    await expectStatus(tech, 'GET', '/api/shop/settings', 200)
    for (const c of [tech, desk]) await expectStatus(c, 'GET', '/api/mail', 403)
    await expectStatus(owner, 'GET', '/api/mail', 200)
    expect((await client().get('/api/jobs')).status).toBe(401)
  })

  it('the owner deletes softly: gone from lists and reads, kept in the table as a tombstone', async () => {
    const { job, customer, amp } = await checkIn()
    expect((await owner.del(`/api/jobs/${job.id}`)).status).toBe(200)
    expect((await owner.get(`/api/jobs/${job.id}`)).status).toBe(404)
    expect((await owner.get(`/api/jobs?customer=${customer.id}`)).body.total).toBe(0)
    expect((await owner.patch(`/api/jobs/${job.id}`, { complaint: 'too late' })).status).toBe(404)
    const [row] = await sql('select deleted_at from jobs where id = ?', [job.id])
    expect(row.deleted_at).not.toBeNull()
    expect((await owner.del(`/api/amps/${amp.id}`)).status).toBe(200)
    expect((await owner.get(`/api/amps/${amp.id}`)).status).toBe(404)
    expect((await owner.del(`/api/customers/${customer.id}`)).status).toBe(200)
    expect((await owner.get(`/api/customers?q=${encodeURIComponent(customer.name)}`)).body.total).toBe(0)
  })

  it('searches customers by name or e-mail and amps by serial', async () => {
    const { t, customer, amp } = await checkIn()
    expect((await desk.get(`/api/customers?q=c-${t}@`)).body.items.map((c: { id: string }) => c.id)).toEqual([customer.id])
    expect((await desk.get(`/api/customers?q=${encodeURIComponent(`Customer ${t}`)}`)).body.total).toBe(1)
    expect((await desk.get(`/api/amps?q=TST-${t}`)).body.items.map((a: { id: string }) => a.id)).toEqual([amp.id])
  })

  it('another shop\'s ids answer 404', async () => {
    const { job, customer, amp } = await checkIn()
    const o = other.c
    for (const [method, path, body] of [
      ['GET', `/api/jobs/${job.id}`], ['PATCH', `/api/jobs/${job.id}`, { complaint: 'x' }], ['DELETE', `/api/jobs/${job.id}`],
      ['GET', `/api/customers/${customer.id}`], ['PATCH', `/api/customers/${customer.id}`, { name: 'x' }], ['DELETE', `/api/customers/${customer.id}`],
      ['GET', `/api/amps/${amp.id}`], ['PATCH', `/api/amps/${amp.id}`, { serial: 'x' }], ['DELETE', `/api/amps/${amp.id}`],
      ['POST', `/api/jobs/${job.id}/invoices`, { kind: 'estimate' }],
    ] as [string, string, unknown?][]) {
      expect((await o.raw(method, path, body)).status, `${method} ${path}`).toBe(404)
    }
    expect((await o.get(`/api/jobs?q=TST-${amp.serial.slice(4)}`)).body.total).toBe(0)
    // Pointing a new job of its own at this shop's customer is refused too.
    const r = await o.post('/api/jobs', { customerId: customer.id, ampId: amp.id, complaint: 'not ours' })
    expect(r.status).toBe(404)
    expect(r.body.message).toMatch(/not found in this shop/)
    expect((await owner.get(`/api/jobs/${job.id}`)).body.complaint).toBe(job.complaint)
  })

  it('the owner sets the shop rates; the currency is kept as three lower-case letters', async () => {
    const o = other.c
    const r = await o.patch('/api/shop/settings', { labourRateCents: 8500, taxRateBasisPoints: 700, currency: 'EUR', readyEmail: false })
    expect(r.status).toBe(200)
    expect(r.body).toMatchObject({ labourRateCents: 8500, taxRateBasisPoints: 700, currency: 'eur', readyEmail: false })
    expect((await o.patch('/api/shop/settings', { readyEmail: true })).body).toMatchObject({ labourRateCents: 8500, readyEmail: true })
  })
})
