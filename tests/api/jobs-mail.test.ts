import { randomUUID } from 'node:crypto'
import { beforeAll, describe, expect, it } from 'vitest'
import { SYNC_SCHEMA_VERSION } from '../../shared/utils/sync/protocol'
import { DEMO, login, newOwner, type Client } from './helpers/client'
import { sql } from './helpers/db'
import { caughtMail, waitForMail } from './helpers/mail'

let owner: Client, desk: Client, tech: Client

beforeAll(async () => {
  [owner, desk, tech] = await Promise.all([DEMO.owner, DEMO.desk, DEMO.tech].map(e => login(e)))
})

async function jobFor(c: Client, email: string) {
  const customer = (await c.post('/api/customers', { name: 'Ready Customer', email })).body
  const amp = (await c.post('/api/amps', { customerId: customer.id, description: '100 W four-6L6 head', serial: `RDY-${randomUUID().slice(0, 6)}` })).body
  const job = (await c.post('/api/jobs', { customerId: customer.id, ampId: amp.id, complaint: 'Cuts out' })).body
  return { job, amp }
}

const readyMails = (to: string) => caughtMail().filter(m => m.to.includes(to) && m.raw.includes('Your amp is ready'))
const settle = () => new Promise(r => setTimeout(r, 1000))

describe('"your amp is ready" e-mail', () => {
  it('is sent once when a sync push moves the job to ready, and not again for duplicate pushes', async () => {
    const email = `ready-${randomUUID().slice(0, 8)}@test.example`
    const { job } = await jobFor(desk, email)
    const body = {
      clientId: randomUUID(), shopId: DEMO.shopId, schemaVersion: SYNC_SCHEMA_VERSION,
      mutations: [
        { id: 1, uuid: randomUUID(), name: 'job.setFields', args: { id: job.id, fields: { status: 'on-bench' } }, baseVersion: job.version },
        { id: 2, uuid: randomUUID(), name: 'job.setFields', args: { id: job.id, fields: { status: 'ready' } }, baseVersion: job.version },
      ],
    }
    const first = await tech.post('/api/sync/push', body)
    expect(first.body.results.map((r: { status: string }) => r.status)).toEqual(['applied', 'applied'])
    const mail = await waitForMail(email)
    expect(mail.raw).toContain('Your amp is ready to collect from Larkspur Amp Works')
    // The same push again, five times at once (a lost reply and retries).
    const again = await Promise.all(Array.from({ length: 5 }, () => tech.post('/api/sync/push', body)))
    for (const r of again) expect(r.body.results.map((x: { status: string }) => x.status)).toEqual(['duplicate', 'duplicate'])
    await settle()
    expect(readyMails(email)).toHaveLength(1)
    const logged = await sql<{ body: string, delivered: number, shop_id: string }>('select body, delivered, shop_id from sent_mail where to_address = ?', [email])
    expect(logged).toHaveLength(1)
    expect(logged[0]).toMatchObject({ delivered: 1, shop_id: DEMO.shopId })
    expect(logged[0]!.body).toContain(`/jobs/${job.id}`)
    expect(logged[0]!.body).toContain('100 W four-6L6 head')
  })

  it('is not sent when the move to ready is refused, and is sent for a move through REST', async () => {
    const email = `ready-rest-${randomUUID().slice(0, 8)}@test.example`
    const { job } = await jobFor(desk, email)
    // checked-in -> ready is not a move the flow allows: rejected, so nothing is queued.
    const refused = await tech.post('/api/sync/push', {
      clientId: randomUUID(), shopId: DEMO.shopId, schemaVersion: SYNC_SCHEMA_VERSION,
      mutations: [{ id: 1, uuid: randomUUID(), name: 'job.setFields', args: { id: job.id, fields: { status: 'ready' } }, baseVersion: job.version }],
    })
    expect(refused.body.results[0].status).toBe('rejected')
    expect((await tech.patch(`/api/jobs/${job.id}`, { status: 'ready' })).status).toBe(400)
    await settle()
    expect(readyMails(email)).toHaveLength(0)
    expect((await tech.patch(`/api/jobs/${job.id}`, { status: 'on-bench' })).status).toBe(200)
    expect((await tech.patch(`/api/jobs/${job.id}`, { status: 'ready' })).status).toBe(200)
    await waitForMail(email)
    // A later edit that leaves the status alone sends nothing more.
    expect((await tech.patch(`/api/jobs/${job.id}`, { accessories: 'Cover' })).status).toBe(200)
    await settle()
    expect(readyMails(email)).toHaveLength(1)
  })

  it('is not sent when the shop has switched it off, and the owner\'s outbox lists what was sent, newest first', async () => {
    const shop = await newOwner('quiet')
    expect((await shop.c.patch('/api/shop/settings', { readyEmail: false })).status).toBe(200)
    const email = `quiet-${randomUUID().slice(0, 8)}@test.example`
    const { job } = await jobFor(shop.c, email)
    await shop.c.patch(`/api/jobs/${job.id}`, { status: 'on-bench' })
    expect((await shop.c.patch(`/api/jobs/${job.id}`, { status: 'ready' })).body.status).toBe('ready')
    await settle()
    expect(readyMails(email)).toHaveLength(0)
    expect((await shop.c.get('/api/mail')).body.items).toEqual([])

    await shop.c.patch('/api/shop/settings', { readyEmail: true })
    await shop.c.patch(`/api/jobs/${job.id}`, { status: 'on-bench' })
    await shop.c.patch(`/api/jobs/${job.id}`, { status: 'ready' })
    await waitForMail(email)
    await expect.poll(async () => (await shop.c.get('/api/mail')).body.items.length).toBe(1)
    const outbox = (await shop.c.get('/api/mail')).body.items
    expect(outbox[0]).toMatchObject({ to: email, subject: expect.stringContaining('Your amp is ready'), delivered: true })
    // The demo shop's outbox is its own.
    const demo = (await owner.get('/api/mail')).body.items as { to: string, createdAt: string }[]
    expect(demo.some(m => m.to === email)).toBe(false)
    const times = demo.map(m => Date.parse(m.createdAt))
    expect(times).toEqual([...times].sort((a, b) => b - a))
  })
})
