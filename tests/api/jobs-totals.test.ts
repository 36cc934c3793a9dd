import { randomUUID } from 'node:crypto'
import { beforeAll, describe, expect, it } from 'vitest'
import { SYNC_SCHEMA_VERSION } from '../../shared/utils/sync/protocol'
import { DEMO, login, type Client } from './helpers/client'

let desk: Client, tech: Client, dana: Client, owner: Client

beforeAll(async () => {
  ;[desk, tech, dana, owner] = await Promise.all([DEMO.desk, DEMO.tech, DEMO.dana, DEMO.owner].map(e => login(e)))
})

describe('a job\'s totals', () => {
  it('are the same for every role that sees the job, and equal the invoice made from it', async () => {
    const danaCustomer = (await desk.get('/api/customers?q=dana@players.example')).body.items[0]
    const amp = (await desk.post('/api/amps', { customerId: danaCustomer.id, description: 'two-6V6 combo, fixed bias' })).body
    const job = (await desk.post('/api/jobs', { customerId: danaCustomer.id, ampId: amp.id, complaint: 'Totals check' })).body
    const shopId = DEMO.shopId
    const r = await tech.post('/api/sync/push', {
      clientId: randomUUID(), shopId, schemaVersion: SYNC_SCHEMA_VERSION,
      mutations: [
        { id: 1, uuid: randomUUID(), name: 'jobPart.create', args: { id: randomUUID(), jobId: job.id, description: 'Matched pair 6V6GT', quantity: 1, unitPriceCents: 8950 } },
        { id: 2, uuid: randomUUID(), name: 'jobLabour.create', args: { id: randomUUID(), jobId: job.id, description: 'Set bias', minutes: 60, rateCents: 9000 } },
      ],
    })
    expect(r.body.results.map((x: { status: string }) => x.status)).toEqual(['applied', 'applied'])

    const settings = (await owner.get('/api/shop/settings')).body
    // Source: arithmetic, worked by hand: $89.50 + 1 h x rate; tax at the shop's basis points, rounded to the cent.
    const subtotal = 8950 + 9000
    const tax = Math.round(subtotal * settings.taxRateBasisPoints / 10_000)
    const seen = []
    for (const c of [owner, tech, desk, dana]) {
      const got = await c.get(`/api/jobs/${job.id}`)
      expect(got.status).toBe(200)
      seen.push(got.body.totals)
    }
    for (const t of seen) expect(t).toEqual(seen[0])
    expect(seen[0]).toMatchObject({ subtotalCents: subtotal, taxCents: tax, totalCents: subtotal + tax, taxRateBasisPoints: settings.taxRateBasisPoints })

    const inv = (await desk.post(`/api/jobs/${job.id}/invoices`, { kind: 'invoice' })).body
    expect(inv.totalCents).toBe(seen[0].totalCents)
    expect(inv.taxCents).toBe(seen[0].taxCents)
    expect((await dana.get('/api/shop/settings')).body.taxRateBasisPoints).toBe(inv.taxRateBasisPoints)
  })
})
