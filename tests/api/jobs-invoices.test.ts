import { randomUUID } from 'node:crypto'
import { beforeAll, describe, expect, it } from 'vitest'
import { SYNC_SCHEMA_VERSION } from '../../shared/utils/sync/protocol'
import { DEMO, login, newOwner, type Client } from './helpers/client'
import { sql } from './helpers/db'
import { waitForMail } from './helpers/mail'

type Shop = Awaited<ReturnType<typeof newOwner>>
let shop: Shop
let desk: Client, tech: Client, dana: Client, owner: Client

/** Sync mutations from a fresh device id, as a phone would send them. */
async function push(c: Client, shopId: string, mutations: { name: string, args: unknown, baseVersion?: number }[]) {
  const r = await c.post('/api/sync/push', { clientId: randomUUID(), shopId, schemaVersion: SYNC_SCHEMA_VERSION, mutations: mutations.map((m, i) => ({ id: i + 1, uuid: randomUUID(), ...m })) })
  expect(r.status).toBe(200)
  expect(r.body.results.map((x: { status: string }) => x.status)).toEqual(mutations.map(() => 'applied'))
}

/** A job in `c`'s active shop with parts and labour added by a device (parts are bench work). */
async function jobWithWork(c: Client, shopId: string, parts: { quantity: number, unitPriceCents: number }[], labour: { minutes: number, rateCents: number }[], email = `inv-${randomUUID().slice(0, 8)}@test.example`) {
  const customer = (await c.post('/api/customers', { name: 'Invoice Customer', email })).body
  const amp = (await c.post('/api/amps', { customerId: customer.id, description: '18 W two-EL84 combo, cathode biased' })).body
  const job = (await c.post('/api/jobs', { customerId: customer.id, ampId: amp.id, complaint: 'Retube' })).body
  await push(c, shopId, [
    ...parts.map((p, i) => ({ name: 'jobPart.create', args: { id: randomUUID(), jobId: job.id, description: `Part ${i + 1}`, ...p } })),
    ...labour.map((l, i) => ({ name: 'jobLabour.create', args: { id: randomUUID(), jobId: job.id, description: `Labour ${i + 1}`, ...l } })),
  ])
  return { job, customer, email }
}

beforeAll(async () => {
  shop = await newOwner('invoices')
  ;[desk, tech, dana, owner] = await Promise.all([DEMO.desk, DEMO.tech, DEMO.dana, DEMO.owner].map(e => login(e)))
  expect((await shop.c.patch('/api/shop/settings', { labourRateCents: 9000, taxRateBasisPoints: 825, currency: 'usd' })).status).toBe(200)
})

describe('estimates and invoices', () => {
  it('builds the lines and totals from the job\'s parts and labour at the shop\'s tax rate', async () => {
    const { job } = await jobWithWork(shop.c, shop.shopId, [{ quantity: 2, unitPriceCents: 6400 }], [{ minutes: 90, rateCents: 9000 }])
    const r = await shop.c.post(`/api/jobs/${job.id}/invoices`, { kind: 'invoice' })
    expect(r.status).toBe(201)
    // Source: arithmetic, worked by hand: 2 x 6400 = 12 800; 1.5 h x 9000 = 13 500; subtotal 26 300;
    // tax 26 300 x 8.25 % = 2 169.75 -> 2 170 (round half away from zero, common practice, no source); total 28 470.
    expect(r.body).toMatchObject({ state: 'draft', kind: 'invoice', partsCents: 12_800, labourCents: 13_500, subtotalCents: 26_300, taxRateBasisPoints: 825, taxCents: 2170, totalCents: 28_470, currency: 'usd' })
    expect(r.body.lines).toEqual([
      { kind: 'part', description: 'Part 1', quantity: 2, unitCents: 6400, totalCents: 12_800 },
      { kind: 'labour', description: 'Labour 1', quantity: 1.5, unitCents: 9000, totalCents: 13_500 },
    ])
    expect(r.body.version).toBeGreaterThan(job.version)
    const detail = await shop.c.get(`/api/jobs/${job.id}`)
    expect(detail.body.invoices.map((i: { id: string }) => i.id)).toEqual([r.body.id])
  })

  it('leaves out deleted parts and counts estimates apart from invoices', async () => {
    const { job } = await jobWithWork(shop.c, shop.shopId, [{ quantity: 4, unitPriceCents: 700 }, { quantity: 1, unitPriceCents: 99_999 }], [{ minutes: 150, rateCents: 9000 }])
    const [expensive] = await sql<{ id: string }>('select id from job_parts where job_id = ? and unit_price_cents = 99999', [job.id])
    await push(shop.c, shop.shopId, [{ name: 'jobPart.delete', args: { id: expensive!.id }, baseVersion: 1e9 }])
    const est = await shop.c.post(`/api/jobs/${job.id}/invoices`, { kind: 'estimate' })
    // Source: arithmetic, worked by hand: 4 x 700 = 2 800; 2.5 h x 9000 = 22 500; subtotal 25 300;
    // tax 25 300 x 8.25 % = 2 087.25 -> 2 087; total 27 387.
    expect(est.body).toMatchObject({ kind: 'estimate', partsCents: 2800, labourCents: 22_500, subtotalCents: 25_300, taxCents: 2087, totalCents: 27_387 })
    const inv = await shop.c.post(`/api/jobs/${job.id}/invoices`, { kind: 'invoice' })
    const numbers = await sql<{ kind: string, number: number }>('select kind, number from invoices where id in (?, ?)', [est.body.id, inv.body.id])
    expect(numbers.find(n => n.kind === 'estimate')!.number).toBeLessThanOrEqual(numbers.find(n => n.kind === 'invoice')!.number)
  })

  it('hands out distinct numbers in sequence when many are created at once', async () => {
    const fresh = await newOwner('sequence')
    const { job } = await jobWithWork(fresh.c, fresh.shopId, [{ quantity: 1, unitPriceCents: 1000 }], [])
    const replies = await Promise.all(Array.from({ length: 12 }, (_, i) => fresh.c.post(`/api/jobs/${job.id}/invoices`, { kind: i % 3 === 0 ? 'estimate' : 'invoice' })))
    expect(replies.map(r => r.status)).toEqual(replies.map(() => 201))
    const by = (k: string) => replies.filter(r => r.body.kind === k).map(r => r.body.number as number).sort((a, b) => a - b)
    expect(by('invoice')).toEqual([1, 2, 3, 4, 5, 6, 7, 8])
    expect(by('estimate')).toEqual([1, 2, 3, 4])
    const versions = replies.map(r => r.body.version as number)
    expect(new Set(versions).size).toBe(12)
  })

  it('refuses an empty job, a player, a tech and another shop', async () => {
    const customer = (await shop.c.post('/api/customers', { name: 'Nothing yet' })).body
    const amp = (await shop.c.post('/api/amps', { customerId: customer.id, description: 'two-6V6 combo, fixed bias' })).body
    const job = (await shop.c.post('/api/jobs', { customerId: customer.id, ampId: amp.id, complaint: 'Look at it' })).body
    const empty = await shop.c.post(`/api/jobs/${job.id}/invoices`, { kind: 'invoice' })
    expect(empty.status).toBe(400)
    expect(empty.body.message).toMatch(/parts or labour/)
    expect((await shop.c.post(`/api/jobs/${job.id}/invoices`, { kind: 'receipt' })).status).toBe(400)
    expect((await tech.post(`/api/jobs/${job.id}/invoices`, { kind: 'invoice' })).status).toBe(403)
    expect((await dana.post(`/api/jobs/${job.id}/invoices`, { kind: 'invoice' })).status).toBe(403)
    expect((await desk.post(`/api/jobs/${job.id}/invoices`, { kind: 'invoice' })).status).toBe(404)
  })

  it('sends (mailing the customer with the total and a link), voids, and refuses the other moves', async () => {
    const { job, email } = await jobWithWork(owner, DEMO.shopId, [{ quantity: 1, unitPriceCents: 5200 }], [{ minutes: 60, rateCents: 9000 }])
    const inv = (await desk.post(`/api/jobs/${job.id}/invoices`, { kind: 'invoice' })).body
    expect((await tech.patch(`/api/invoices/${inv.id}`, { state: 'sent' })).status).toBe(403)
    expect((await desk.patch(`/api/invoices/${inv.id}`, { state: 'paid' })).status).toBe(400)
    const sent = await desk.patch(`/api/invoices/${inv.id}`, { state: 'sent' })
    expect(sent.status).toBe(200)
    expect(sent.body.state).toBe('sent')
    expect(sent.body.issuedAt).not.toBeNull()
    expect(sent.body.version).toBeGreaterThan(inv.version)
    const mail = await waitForMail(email)
    expect(mail.raw).toMatch(new RegExp(`invoice no\\. ${inv.number} from`))
    const [logged] = await sql<{ body: string, delivered: number }>('select body, delivered from sent_mail where to_address = ?', [email])
    // Source: arithmetic, worked by hand: 5 200 + 9 000 = 14 200; x 8.25 % = 1 171.5 -> 1 172; total 15 372 = $153.72.
    expect(logged!.body).toContain('$153.72')
    // An invoice's e-mail carries its pay link (no account needed), not the job page.
    expect(logged!.body).toMatch(/\/pay\/[\w-]{43}/)
    expect(logged!.delivered).toBe(1)
    expect((await desk.patch(`/api/invoices/${inv.id}`, { state: 'sent' })).status).toBe(400)
    const voided = await owner.patch(`/api/invoices/${inv.id}`, { state: 'void' })
    expect(voided.body.state).toBe('void')
    expect(voided.body.version).toBeGreaterThan(sent.body.version)
    expect((await owner.patch(`/api/invoices/${inv.id}`, { state: 'sent' })).status).toBe(400)
  })

  it('syncs invoices down to staff devices, and to the linked player once sent', async () => {
    const danaCustomer = (await desk.get('/api/customers?q=dana@players.example')).body.items[0]
    const amp = (await desk.post('/api/amps', { customerId: danaCustomer.id, description: 'two-6V6 combo, fixed bias' })).body
    const job = (await desk.post('/api/jobs', { customerId: danaCustomer.id, ampId: amp.id, complaint: 'Bias check' })).body
    await push(owner, DEMO.shopId, [{ name: 'jobLabour.create', args: { id: randomUUID(), jobId: job.id, minutes: 30, rateCents: 9000 } }])
    const inv = (await desk.post(`/api/jobs/${job.id}/invoices`, { kind: 'estimate' })).body
    const pull = async (c: Client) => {
      const clientId = randomUUID()
      const r = await c.post('/api/sync/pull', { clientId, shopId: DEMO.shopId, schemaVersion: SYNC_SCHEMA_VERSION, cookie: null })
      const all = [...r.body.changes]
      let cookie = r.body.cookie
      let more = r.body.more
      while (more) {
        const next = await c.post('/api/sync/pull', { clientId, shopId: DEMO.shopId, schemaVersion: SYNC_SCHEMA_VERSION, cookie })
        all.push(...next.body.changes)
        cookie = next.body.cookie
        more = next.body.more
      }
      return all.filter((ch: { table: string, id: string }) => ch.table === 'invoices' && ch.id === inv.id)
    }
    expect((await pull(tech))[0]).toMatchObject({ version: inv.version, data: { state: 'draft', number: inv.number } })
    expect(await pull(dana)).toEqual([])
    expect((await dana.get(`/api/invoices/${inv.id}`)).status).toBe(404)
    const sent = (await desk.patch(`/api/invoices/${inv.id}`, { state: 'sent' })).body
    expect((await pull(dana))[0]).toMatchObject({ version: sent.version, data: { state: 'sent', kind: 'estimate' } })
    expect((await dana.get(`/api/invoices/${inv.id}`)).body.totalCents).toBe(inv.totalCents)
  })
})
