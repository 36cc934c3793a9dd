import { createHash, randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { SYNC_SCHEMA_VERSION } from '../../shared/utils/sync/protocol'
import { setSpread } from '../../shared/utils/bench/set-spread'
import { DEMO, login, ownerOfNewShop, type Client } from './helpers/client'
import { device } from './helpers/devices'
import { sql } from './helpers/db'

interface Result { id: number, status: string, reason?: string }
interface Change { name: string, args: unknown, baseVersion?: number, uuid?: string }

/** One device's push log: its client id and mutation numbers carry on from push to push. */
function pusher(c: Client, shopId = DEMO.shopId) {
  const clientId = randomUUID()
  let next = 1
  const sent: (Change & { id: number, uuid: string })[] = []
  return {
    sent,
    async push(changes: Change[]): Promise<Result[]> {
      const mutations = changes.map(m => ({ id: next++, uuid: m.uuid ?? randomUUID(), name: m.name, args: m.args, ...(m.baseVersion === undefined ? {} : { baseVersion: m.baseVersion }) }))
      sent.push(...mutations)
      return this.resend(mutations)
    },
    /** The same mutations again, as a device does when it never saw the answer. */
    async resend(mutations: unknown[]): Promise<Result[]> {
      const r = await c.post('/api/sync/push', { clientId, shopId, schemaVersion: SYNC_SCHEMA_VERSION, mutations })
      expect(r.status, JSON.stringify(r.body)).toBe(200)
      return r.body.results
    },
  }
}
const statuses = (rs: Result[]) => rs.map(r => r.status)
const versionOf = async (table: string, id: string) => Number((await sql(`select version from ${table} where id = ?`, [id]))[0].version)
const openJob = async () => (await sql<{ id: string }>('select id from jobs where shop_id = ? and status in (\'checked-in\', \'on-bench\') and deleted_at is null order by id limit 2', [DEMO.shopId]))
const today = new Date().toISOString().slice(0, 10)

/** A lot of 6L6GC with the given readings (mA), each tube marked for `setId` where given. */
function lotWithTubes(mA: number[], opts: { setId?: string | null, costCents?: number, tubeType?: string } = {}) {
  const lotId = randomUUID()
  const tubeIds = mA.map(() => randomUUID())
  const changes: Change[] = [
    { name: 'tubeLot.create', args: { id: lotId, tubeType: opts.tubeType ?? '6l6gc', maker: 'Test lot', costCents: opts.costCents ?? 2000 } },
    ...mA.map((m, i) => ({ name: 'stockTube.create', args: { id: tubeIds[i], lotId, label: `T${i + 1}`, plateVolts: 400, gridVolts: -45, amps: m / 1000, testedOn: today, setId: opts.setId ?? null } })),
  ]
  return { lotId, tubeIds, changes }
}

function pairOf(mA: [number, number], extra: { label?: string, costCents?: number } = {}) {
  const setId = randomUUID()
  const lot = lotWithTubes(mA, { setId, costCents: extra.costCents })
  const label = extra.label ?? `S-T${Math.floor(Math.random() * 1e6)}`
  const create = { name: 'matchedSet.create', args: { id: setId, tubeType: '6l6gc', label, tubeIds: lot.tubeIds, size: 2, spreadFraction: setSpread(mA.map(m => m / 1000)) } }
  return { setId, label, lot, changes: [...lot.changes, create] }
}

describe('tube stock: who may see and change it', () => {
  it('the demo shop has two lots of read tubes and a matched quad in stock, which the desk can read', async () => {
    const desk = await login(DEMO.desk)
    const r = await desk.get('/api/stock')
    expect(r.status).toBe(200)
    const lot = r.body.lots.find((l: { tubeType: string, maker: string }) => l.tubeType === '6l6gc' && l.maker.startsWith('Generic'))
    expect(lot.tubes).toHaveLength(6)
    const quad = r.body.sets.find((s: { label: string }) => s.label === 'S-1')
    expect(quad).toMatchObject({ size: 4, status: 'in-stock', fittedJobId: null })
    const amps = quad.tubeIds.map((id: string) => lot.tubes.find((t: { id: string }) => t.id === id).amps)
    // Source: the demo readings, 42.5 mA / 41.2 mA − 1 (by hand: 3.155 %)
    expect(quad.spreadFraction).toBeCloseTo(42.5 / 41.2 - 1, 9)
    expect(quad.spreadFraction).toBeCloseTo(setSpread(amps), 12)
    const one = await desk.get(`/api/stock/sets/${quad.id}`)
    expect(one.status).toBe(200)
    expect(one.body.tubes.map((t: { label: string }) => t.label).sort()).toEqual(['L1-01', 'L1-02', 'L1-03', 'L1-04'])
  })

  it('owner and tech create and change lots and tubes; the desk may not (403); bad input is 400', async () => {
    const tech = await login(DEMO.tech)
    const owner = await login(DEMO.owner)
    const desk = await login(DEMO.desk)
    const made = await tech.post('/api/stock/lots', { tubeType: 'el34', maker: 'Test EL34', costCents: 1500 })
    expect(made.status, JSON.stringify(made.body)).toBe(201)
    const tube = await owner.post('/api/stock/tubes', { lotId: made.body.id, label: 'X-01', plateVolts: 400, gridVolts: -38, amps: 0.05, transconductance: 0.011, testedOn: today, testedBy: 'Owen Pryde' })
    expect(tube.status, JSON.stringify(tube.body)).toBe(201)
    expect(tube.body).toMatchObject({ amps: 0.05, transconductance: 0.011, setId: null })
    expect((await owner.patch(`/api/stock/tubes/${tube.body.id}`, { amps: 0.051 })).body.amps).toBe(0.051)
    expect((await tech.patch(`/api/stock/lots/${made.body.id}`, { notes: 'Two with loose bases.' })).status).toBe(200)

    expect((await desk.post('/api/stock/lots', { tubeType: 'el34' })).status).toBe(403)
    expect((await desk.patch(`/api/stock/lots/${made.body.id}`, { notes: 'desk' })).status).toBe(403)
    expect((await desk.del(`/api/stock/tubes/${tube.body.id}`)).status).toBe(403)

    const unknown = await tech.post('/api/stock/lots', { tubeType: 'no-such-tube' })
    expect(unknown.status).toBe(400)
    expect(unknown.body.message).toMatch(/not in the Tubes library/)
    const positiveGrid = await tech.post('/api/stock/tubes', { lotId: made.body.id, label: 'X-02', plateVolts: 400, gridVolts: 5, amps: 0.05, testedOn: today })
    expect(positiveGrid.status).toBe(400)
    expect(positiveGrid.body.message).toMatch(/zero or negative/)
    const noLot = await tech.post('/api/stock/tubes', { lotId: randomUUID(), label: 'X-03', plateVolts: 400, gridVolts: -40, amps: 0.05, testedOn: today })
    expect(noLot.status).toBe(404)
    expect(noLot.body.message).toMatch(/Lot not found in this shop/)
    expect((await tech.del(`/api/stock/tubes/${tube.body.id}`)).status).toBe(200)
  })

  it('a player gets 403 from every stock route and pulls none of it; another shop gets 404', async () => {
    const dana = await login(DEMO.dana)
    expect((await dana.get('/api/stock')).status).toBe(403)
    expect((await dana.post('/api/stock/lots', { tubeType: '6l6gc' })).status).toBe(403)
    const [quad] = await sql<{ id: string }>('select id from matched_sets where shop_id = ? and label = \'S-1\'', [DEMO.shopId])
    expect((await dana.get(`/api/stock/sets/${quad!.id}`)).status).toBe(403)

    const p = pusher(dana)
    const rs = await p.push([{ name: 'tubeLot.create', args: { id: randomUUID(), tubeType: '6l6gc' } }])
    expect(rs[0]).toMatchObject({ status: 'rejected', reason: expect.stringMatching(/your role may not create tubeLots/) })

    const d = await device(dana, DEMO.shopId)
    await d.engine.pull()
    expect(await d.db.tubeLots.count()).toBe(0)
    expect(await d.db.stockTubes.count()).toBe(0)
    expect(await d.db.matchedSets.count()).toBe(0)
    const t = await device(await login(DEMO.tech), DEMO.shopId)
    await t.engine.pull()
    expect(await t.db.matchedSets.get(quad!.id)).toMatchObject({ label: 'S-1', status: 'in-stock' })

    const other = await ownerOfNewShop()
    expect((await other.client.get(`/api/stock/sets/${quad!.id}`)).status).toBe(404)
    const lotId = (await sql<{ lot_id: string }>('select lot_id from stock_tubes where set_id = ? limit 1', [quad!.id]))[0]!.lot_id
    expect((await other.client.patch(`/api/stock/lots/${lotId}`, { notes: 'not mine' })).status).toBe(404)
    expect((await other.client.get('/api/stock')).body).toEqual({ lots: [], sets: [] })
  })

  it('the desk may not make or fit sets by sync either', async () => {
    const desk = await login(DEMO.desk)
    const pair = pairOf([40, 41])
    const rs = await pusher(desk).push(pair.changes)
    expect(statuses(rs)).toEqual(['rejected', 'rejected', 'rejected', 'rejected'])
  })
})

describe('matched sets', () => {
  it('takes a set only of this shop\'s tubes, marked for it, of its type, with the spread their readings give', async () => {
    const tech = pusher(await login(DEMO.tech))
    const setId = randomUUID()
    const unmarked = lotWithTubes([40, 41])
    const el34 = lotWithTubes([40, 41], { setId, tubeType: 'el34' })
    expect(statuses(await tech.push([...unmarked.changes, ...el34.changes]))).toEqual(Array(6).fill('applied'))
    const base = { id: setId, tubeType: '6l6gc', label: 'S-bad', size: 2, spreadFraction: setSpread([0.040, 0.041]) }
    const rs = await tech.push([
      { name: 'matchedSet.create', args: { ...base, tubeIds: unmarked.tubeIds } },
      { name: 'matchedSet.create', args: { ...base, tubeIds: el34.tubeIds } },
      { name: 'matchedSet.create', args: { ...base, tubeType: 'el34', tubeIds: el34.tubeIds, spreadFraction: 0.001 } },
      { name: 'matchedSet.create', args: { ...base, tubeType: 'el34', tubeIds: el34.tubeIds, size: 4 } },
    ])
    expect(rs.map(r => r.reason)).toEqual([
      expect.stringMatching(/tube T1 is not marked for this set \(it is in no set\)/),
      expect.stringMatching(/tube T1 is a el34, not a 6l6gc/),
      // By hand: 41 / 40 − 1 = 2.5 %
      expect.stringMatching(/the spread does not match the tubes' readings \(they give 2\.50 %\)/),
      expect.stringMatching(/a quad has 4 tubes; 2 were named/),
    ])
    expect(statuses(await tech.push([{ name: 'matchedSet.create', args: { ...base, tubeType: 'el34', tubeIds: el34.tubeIds } }]))).toEqual(['applied'])
    // A tube in a set keeps the reading it was matched on.
    const moved = await tech.push([{ name: 'stockTube.setFields', args: { id: el34.tubeIds[0], fields: { amps: 0.045 } }, baseVersion: await versionOf('stock_tubes', el34.tubeIds[0]!) }])
    expect(moved[0]).toMatchObject({ status: 'rejected', reason: expect.stringMatching(/is in set S-bad: its reading is what matched it/) })
  })
})

describe('fitting a set to a job', () => {
  it('moves the set out of stock exactly once: a re-sent mutation is a duplicate, a second fit is refused, one part', async () => {
    const techClient = await login(DEMO.tech)
    const tech = pusher(techClient)
    const pair = pairOf([40, 41], { costCents: 2150 })
    expect(statuses(await tech.push(pair.changes))).toEqual(['applied', 'applied', 'applied', 'applied'])
    const [jobA, jobB] = await openJob()
    const fit = { name: 'matchedSet.setFields', args: { id: pair.setId, fields: { status: 'fitted', fittedJobId: jobA!.id, fittedAt: new Date().toISOString(), priceCents: 6400 } }, baseVersion: await versionOf('matched_sets', pair.setId) }
    const before = await versionOf('matched_sets', pair.setId)
    expect(statuses(await tech.push([fit]))).toEqual(['applied'])
    const sentFit = tech.sent.at(-1)!

    // The answer was lost: the device sends the very same mutation again.
    expect(await tech.resend([sentFit])).toEqual([{ id: sentFit.id, status: 'duplicate', was: 'applied' }])
    // Someone taps Fit again (a new mutation), and another device that still saw it in stock fits it elsewhere.
    const again = await tech.push([{ ...fit, uuid: undefined }])
    expect(again[0]).toMatchObject({ status: 'rejected', reason: expect.stringMatching(/set S-T\d+ is already fitted to a job: it has left stock/) })
    const other = pusher(await login(DEMO.owner))
    const stale = await other.push([{ name: 'matchedSet.setFields', args: { id: pair.setId, fields: { status: 'fitted', fittedJobId: jobB!.id, fittedAt: new Date().toISOString() } }, baseVersion: before }])
    expect(stale[0]).toMatchObject({ status: 'rejected', reason: expect.stringMatching(/already fitted/) })

    const [set] = await sql('select status, fitted_job_id from matched_sets where id = ?', [pair.setId])
    expect(set).toEqual({ status: 'fitted', fitted_job_id: jobA!.id })
    const parts = await sql('select job_id, description, quantity, unit_cost_cents, unit_price_cents from job_parts where description like ?', [`%set ${pair.label}`])
    // Cost from the lot: 2 tubes at 21.50 each; the price the tech set.
    expect(parts).toEqual([{ job_id: jobA!.id, description: `Matched pair 6L6GC, set ${pair.label}`, quantity: 1, unit_cost_cents: 4300, unit_price_cents: 6400 }])
    expect(await sql('select id from sync_conflicts where row_id = ?', [pair.setId])).toEqual([])

    // The job's part reaches the job's customer with the job; the set itself does not.
    const d = await device(techClient, DEMO.shopId)
    await d.engine.pull()
    expect((await d.db.jobParts.where('jobId').equals(jobA!.id).toArray()).map(p => p.description)).toContain(`Matched pair 6L6GC, set ${pair.label}`)
    expect((await d.db.matchedSets.get(pair.setId))?.status).toBe('fitted')
  })

  it('in the push that fits the set, a part made with the set\'s part id after the fit is refused; one made before and one after are taken', async () => {
    const tech = pusher(await login(DEMO.tech))
    const pair = pairOf([42, 43])
    const [job] = await openJob()
    // The server names a fitted set's part from the set's id, so a device could send the same id.
    const h = createHash('sha256').update(`matched-set-part:${pair.setId}`).digest('hex')
    const setPart = `${h.slice(0, 8)}-${h.slice(8, 12)}-5${h.slice(13, 16)}-a${h.slice(17, 20)}-${h.slice(20, 32)}`
    const [before, after] = [randomUUID(), randomUUID()]
    const part = (id: string) => ({ name: 'jobPart.create', args: { id, jobId: job!.id, description: 'Fuse, 2 A slow', quantity: 1, unitPriceCents: 150 } })
    const fit = { name: 'matchedSet.setFields', args: { id: pair.setId, fields: { status: 'fitted', fittedJobId: job!.id, fittedAt: new Date().toISOString() } } }
    const rs = await tech.push([...pair.changes, part(before), fit, part(setPart), part(after)])
    expect(rs.slice(4)).toEqual([
      { id: 5, status: 'applied' }, { id: 6, status: 'applied' },
      { id: 7, status: 'rejected', reason: 'a record with this id already exists' }, { id: 8, status: 'applied' },
    ])
    const parts = await sql('select id, description from job_parts where id in (?, ?, ?)', [before, setPart, after])
    expect(parts.map(p => [p.id, p.description]).sort()).toEqual([
      [before, 'Fuse, 2 A slow'], [setPart, `Matched pair 6L6GC, set ${pair.label}`], [after, 'Fuse, 2 A slow'],
    ].sort())
  })

  it('by REST: priced from the lots\' cost when no price is given; a second fit is 400 and the desk 403', async () => {
    const tech = await login(DEMO.tech)
    const desk = await login(DEMO.desk)
    const pair = pairOf([50, 51], { costCents: 1800 })
    expect(statuses(await pusher(tech).push(pair.changes))).toEqual(['applied', 'applied', 'applied', 'applied'])
    const [job] = await openJob()
    expect((await desk.post(`/api/stock/sets/${pair.setId}/fit`, { jobId: job!.id })).status).toBe(403)
    const r = await tech.post(`/api/stock/sets/${pair.setId}/fit`, { jobId: job!.id })
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    expect(r.body.set).toMatchObject({ status: 'fitted', fittedJobId: job!.id })
    expect(r.body.part).toMatchObject({ jobId: job!.id, quantity: 1, unitCostCents: 3600, unitPriceCents: 3600 })
    const again = await tech.post(`/api/stock/sets/${pair.setId}/fit`, { jobId: job!.id })
    expect(again.status).toBe(400)
    expect(again.body.message).toMatch(/already fitted/)
    expect(await sql('select id from job_parts where description like ?', [`%set ${pair.label}`])).toHaveLength(1)
  })

  it('refuses a closed job, a job of another shop and a job that does not exist', async () => {
    const tech = await login(DEMO.tech)
    const pair = pairOf([60, 61])
    expect(statuses(await pusher(tech).push(pair.changes))).toEqual(['applied', 'applied', 'applied', 'applied'])
    const [closed] = await sql<{ id: string }>('select id from jobs where shop_id = ? and status = \'closed\' limit 1', [DEMO.shopId])
    const r = await tech.post(`/api/stock/sets/${pair.setId}/fit`, { jobId: closed!.id })
    expect(r.status).toBe(400)
    expect(r.body.message).toMatch(/The job is closed/)
    expect((await tech.post(`/api/stock/sets/${pair.setId}/fit`, { jobId: randomUUID() })).body.message).toMatch(/Job not found in this shop/)
    expect((await sql('select status from matched_sets where id = ?', [pair.setId]))[0].status).toBe('in-stock')
    expect((await tech.post(`/api/stock/sets/${pair.setId}/fit`, { jobId: 'not-an-id' })).status).toBe(400)
  })
})

/** A job of its own on the demo shop (checked in), so closing or paying it touches no other test. */
async function freshJob(desk: Client) {
  const customer = (await desk.post('/api/customers', { name: 'Stock Customer' })).body
  const amp = (await desk.post('/api/amps', { customerId: customer.id, description: 'two-6L6 combo, fixed bias' })).body
  const job = await desk.post('/api/jobs', { customerId: customer.id, ampId: amp.id, complaint: 'Needs new power tubes.' })
  expect(job.status, JSON.stringify(job.body)).toBe(201)
  return job.body.id as string
}
const livePart = async (setLabel: string) => sql<{ job_id: string }>('select job_id from job_parts where description like ? and deleted_at is null', [`%set ${setLabel}`])

describe('a fitted set back to stock', () => {
  it('takes the job\'s part off and puts the set back exactly once, however often the change is sent', async () => {
    const techClient = await login(DEMO.tech)
    const tech = pusher(techClient)
    const pair = pairOf([44, 45], { costCents: 2000 })
    expect(statuses(await tech.push(pair.changes))).toEqual(['applied', 'applied', 'applied', 'applied'])
    const jobId = await freshJob(await login(DEMO.desk))
    expect((await techClient.post(`/api/stock/sets/${pair.setId}/fit`, { jobId, priceCents: 7000 })).status).toBe(200)
    expect(await livePart(pair.label)).toEqual([{ job_id: jobId }])

    const back = { name: 'matchedSet.setFields', args: { id: pair.setId, fields: { status: 'in-stock', fittedJobId: null, fittedAt: '', priceCents: null } }, baseVersion: await versionOf('matched_sets', pair.setId) }
    expect(statuses(await tech.push([back]))).toEqual(['applied'])
    const sent = tech.sent.at(-1)!
    // The answer was lost: the very same mutation again is a duplicate; a new tap changes nothing more.
    expect(await tech.resend([sent])).toEqual([{ id: sent.id, status: 'duplicate', was: 'applied' }])
    expect(statuses(await tech.push([{ ...back, uuid: undefined }]))).toEqual(['applied'])
    const [set] = await sql('select status, fitted_job_id, fitted_at, price_cents from matched_sets where id = ?', [pair.setId])
    expect(set).toEqual({ status: 'in-stock', fitted_job_id: null, fitted_at: '', price_cents: null })
    expect(await livePart(pair.label)).toEqual([])
    expect(await sql('select id from job_parts where description like ?', [`%set ${pair.label}`])).toHaveLength(1)
    // By REST, asked twice: still in stock, nothing moves.
    const rest = await techClient.post(`/api/stock/sets/${pair.setId}/return`, {})
    expect(rest.status).toBe(200)
    expect(rest.body.set).toMatchObject({ status: 'in-stock' })
    expect(rest.body.part.deletedAt).not.toBeNull()

    // The job's device sees the part gone; the set can be fitted again, and the same part comes back once.
    const d = await device(techClient, DEMO.shopId)
    await d.engine.pull()
    expect((await d.db.jobParts.where('jobId').equals(jobId).toArray()).filter(p => !p.deleted)).toEqual([])
    expect((await d.db.matchedSets.get(pair.setId))?.status).toBe('in-stock')
    expect((await techClient.post(`/api/stock/sets/${pair.setId}/fit`, { jobId })).body.part).toMatchObject({ jobId, unitPriceCents: 4000, deletedAt: null })
    expect(await livePart(pair.label)).toEqual([{ job_id: jobId }])
  })

  it('is refused once the job is closed or its invoice is paid, and for the desk', async () => {
    const techClient = await login(DEMO.tech)
    const desk = await login(DEMO.desk)
    const owner = await login(DEMO.owner)
    const pair = pairOf([46, 47])
    const paidPair = pairOf([48, 49])
    expect(statuses(await pusher(techClient).push([...pair.changes, ...paidPair.changes]))).toEqual(Array(8).fill('applied'))
    const jobId = await freshJob(desk)
    const paidJob = await freshJob(desk)
    expect((await techClient.post(`/api/stock/sets/${pair.setId}/fit`, { jobId })).status).toBe(200)
    expect((await techClient.post(`/api/stock/sets/${paidPair.setId}/fit`, { jobId: paidJob })).status).toBe(200)
    expect((await desk.post(`/api/stock/sets/${pair.setId}/return`, {})).status).toBe(403)

    // Paid: the invoice holds the set's part.
    const inv = (await desk.post(`/api/jobs/${paidJob}/invoices`, { kind: 'invoice' })).body
    expect((await desk.post(`/api/invoices/${inv.id}/counter-payment`, { method: 'cash', amountCents: inv.totalCents })).status).toBe(200)
    const paid = await techClient.post(`/api/stock/sets/${paidPair.setId}/return`, {})
    expect(paid.status).toBe(400)
    expect(paid.body.message).toMatch(new RegExp(`invoice ${inv.number} is paid`))

    // Closed: walk the job to closed, then try.
    for (const status of ['on-bench', 'ready', 'handed-back', 'closed']) {
      expect((await owner.patch(`/api/jobs/${jobId}`, { status })).status).toBe(200)
    }
    const closed = await techClient.post(`/api/stock/sets/${pair.setId}/return`, {})
    expect(closed.status).toBe(400)
    expect(closed.body.message).toMatch(/its job is closed/)
    expect((await sql('select status from matched_sets where id in (?, ?)', [pair.setId, paidPair.setId])).map(r => r.status)).toEqual(['fitted', 'fitted'])
    expect(await livePart(pair.label)).toHaveLength(1)
  })
})

describe('deleting stock', () => {
  it('a set in stock goes; a fitted set, a tube in a set and a lot with a fitted set are refused with the reason', async () => {
    const techClient = await login(DEMO.tech)
    const tech = pusher(techClient)
    const desk = await login(DEMO.desk)
    const kept = pairOf([50, 52])
    const fitted = pairOf([53, 54])
    expect(statuses(await tech.push([...kept.changes, ...fitted.changes]))).toEqual(Array(8).fill('applied'))
    expect((await techClient.post(`/api/stock/sets/${fitted.setId}/fit`, { jobId: await freshJob(desk) })).status).toBe(200)

    expect((await desk.del(`/api/stock/sets/${kept.setId}`)).status).toBe(403)
    const tube = await techClient.del(`/api/stock/tubes/${kept.lot.tubeIds[0]}`)
    expect(tube.status).toBe(400)
    expect(tube.body.message).toMatch(/is in set .*: delete the set first/)
    const set = await techClient.del(`/api/stock/sets/${fitted.setId}`)
    expect(set.status).toBe(400)
    expect(set.body.message).toMatch(new RegExp(`set ${fitted.label} is fitted to a job, so it cannot be deleted: return it to stock first`, 'i'))
    const lot = await techClient.del(`/api/stock/lots/${fitted.lot.lotId}`)
    expect(lot.status).toBe(400)
    expect(lot.body.message).toMatch(/fitted to a job: return the set to stock first/)
    // By sync too: refused, and nothing deleted.
    const rs = await tech.push([{ name: 'matchedSet.delete', args: { id: fitted.setId } }])
    expect(rs[0]).toMatchObject({ status: 'rejected', reason: expect.stringMatching(/cannot be deleted/) })
    expect((await sql('select deleted_at from matched_sets where id = ?', [fitted.setId]))[0].deleted_at).toBeNull()

    // As the stock screen does it: the set, its tubes, then the lot.
    expect(statuses(await tech.push([
      { name: 'matchedSet.delete', args: { id: kept.setId } },
      ...kept.lot.tubeIds.map(id => ({ name: 'stockTube.delete', args: { id } })),
      { name: 'tubeLot.delete', args: { id: kept.lot.lotId } },
    ]))).toEqual(['applied', 'applied', 'applied', 'applied'])
    const after = await desk.get('/api/stock')
    expect(after.body.sets.map((s: { id: string }) => s.id)).not.toContain(kept.setId)
    expect(after.body.lots.map((l: { id: string }) => l.id)).not.toContain(kept.lot.lotId)
  })
})
