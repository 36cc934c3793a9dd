import { createHash, randomBytes, randomUUID } from 'node:crypto'
import { SYNC_SCHEMA_VERSION } from '../../shared/utils/sync/protocol'
import { beforeAll, describe, expect, it } from 'vitest'
import { client, DEMO, login, newOwner, type Client } from './helpers/client'
import { sql } from './helpers/db'
import { caughtMail, waitForMail } from './helpers/mail'

let owner: Client, desk: Client, tech: Client, dana: Client
const anonymous = () => client()

beforeAll(async () => {
  [owner, desk, tech, dana] = await Promise.all([DEMO.owner, DEMO.desk, DEMO.tech, DEMO.dana].map(e => login(e)))
})

/** A walk-in customer (no account) with an e-mail address, a job with an hour of labour, and a draft invoice. */
async function walkInInvoice(minutes = 60) {
  const email = `walkin-${randomUUID().slice(0, 8)}@test.example`
  const customer = (await desk.post('/api/customers', { name: 'Walk-in Customer', email })).body
  const amp = (await desk.post('/api/amps', { customerId: customer.id, description: 'two-6V6 combo, fixed bias', serial: `WLK-${randomUUID().slice(0, 6)}` })).body
  const job = (await desk.post('/api/jobs', { customerId: customer.id, ampId: amp.id, complaint: 'Hums' })).body
  const r = await owner.post('/api/sync/push', {
    clientId: randomUUID(), shopId: DEMO.shopId, schemaVersion: SYNC_SCHEMA_VERSION,
    mutations: [{ id: 1, uuid: randomUUID(), name: 'jobLabour.create', args: { id: randomUUID(), jobId: job.id, minutes, rateCents: 9000, description: 'Bias and clean' } }],
  })
  expect(r.body.results[0].status).toBe('applied')
  const inv = (await desk.post(`/api/jobs/${job.id}/invoices`, { kind: 'invoice' })).body
  return { email, job, inv }
}

/** The pay link in the newest invoice e-mail to this address (quoted-printable soft breaks undone). */
async function mailedToken(email: string, not?: string) {
  const deadline = Date.now() + 5000
  for (;;) {
    const mail = caughtMail().filter(m => m.to.includes(email) && /\/pay\//.test(m.raw.replace(/=\r?\n/g, ''))).at(-1)
    const token = mail?.raw.replace(/=\r?\n/g, '').match(/\/pay\/([\w-]{43})/)?.[1]
    if (token && token !== not) return token
    if (Date.now() > deadline) throw new Error(`no pay link mailed to ${email}`)
    await new Promise(r => setTimeout(r, 100))
  }
}

async function untilPaid(token: string) {
  const deadline = Date.now() + 10_000
  for (;;) {
    const r = await anonymous().get(`/api/pay/${token}`)
    if (r.body.invoice?.state === 'paid') return r.body
    if (Date.now() > deadline) throw new Error(`still ${r.body.invoice?.state}`)
    await new Promise(res => setTimeout(res, 100))
  }
}

describe('the e-mailed pay link', () => {
  it('opens the invoice with no session, pays it through the provider, and only the webhook marks it paid', async () => {
    const { email, inv } = await walkInInvoice(60)
    expect((await desk.patch(`/api/invoices/${inv.id}`, { state: 'sent' })).status).toBe(200)
    const token = await mailedToken(email)
    // Source: RFC 4648 section 5: 32 random bytes are 43 base64url characters, 256 bits (at least 128 asked).
    expect(token).toHaveLength(43)
    // Only the hash is stored.
    const stored = await sql<{ token_hash: string }>('select token_hash from pay_links where invoice_id = ?', [inv.id])
    expect(stored).toEqual([{ token_hash: createHash('sha256').update(token).digest('hex') }])

    const open = await anonymous().get(`/api/pay/${token}`)
    expect(open.status).toBe(200)
    expect(open.body.shop).toMatchObject({ name: 'Larkspur Amp Works', address: 'Unit 3, 18 Kiln Row' })
    // Source: arithmetic by hand: 60 min at 9 000 /h = 9 000; tax 8.25 % = 742.5 -> 743; total 9 743.
    expect(open.body.invoice).toMatchObject({ number: inv.number, state: 'sent', subtotalCents: 9000, taxCents: 743, totalCents: 9743, currency: 'usd' })
    expect(open.body.invoice.lines).toEqual([expect.objectContaining({ kind: 'labour', description: 'Bias and clean', totalCents: 9000 })])
    expect(JSON.stringify(open.body)).not.toMatch(/shopId|jobId|walkin-/)

    const pay = await anonymous().post(`/api/pay/${token}/pay`)
    expect(pay.status).toBe(202)
    expect(pay.body.status).toBe('pending')
    const paid = await untilPaid(token)
    expect(paid.invoice).toMatchObject({ state: 'paid', paidWith: 'online' })
    expect((await anonymous().post(`/api/pay/${token}/pay`)).status).toBe(409)
    const payments = await sql('select status, method from payments where invoice_id = ?', [inv.id])
    expect(payments).toEqual([{ status: 'succeeded', method: 'online' }])
  })

  it('answers 404 for a wrong, malformed, expired or revoked token', async () => {
    const { email, inv } = await walkInInvoice(30)
    await desk.patch(`/api/invoices/${inv.id}`, { state: 'sent' })
    const token = await mailedToken(email)
    for (const wrong of [randomBytes(32).toString('base64url'), 'short', `${token}x`, '%27%20or%201%3D1']) {
      const r = await anonymous().get(`/api/pay/${wrong}`)
      expect(r.status, wrong).toBe(404)
      expect((await anonymous().post(`/api/pay/${wrong}/pay`)).status).toBe(404)
    }
    expect((await anonymous().get(`/api/pay/${token}`)).status).toBe(200)

    // Expired.
    await sql('update pay_links set expires_at = ? where invoice_id = ?', [new Date(Date.now() - 1000), inv.id])
    expect((await anonymous().get(`/api/pay/${token}`)).status).toBe(404)
    expect((await desk.get(`/api/invoices/${inv.id}/pay-link`)).body).toEqual({ live: false, expiresAt: null })

    // A fresh link from the desk works and is mailed; the old one stays dead.
    const fresh = await desk.post(`/api/invoices/${inv.id}/pay-link`)
    expect(fresh.status).toBe(201)
    expect(fresh.body.mailed).toBe(true)
    const newToken = await mailedToken(email, token)
    expect(fresh.body.url).toContain(`/pay/${newToken}`)
    expect((await anonymous().get(`/api/pay/${newToken}`)).status).toBe(200)
    expect((await desk.get(`/api/invoices/${inv.id}/pay-link`)).body.live).toBe(true)

    // Revoked by the desk.
    expect((await tech.del(`/api/invoices/${inv.id}/pay-link`)).status).toBe(403)
    expect((await dana.del(`/api/invoices/${inv.id}/pay-link`)).status).toBe(403)
    const stranger = await newOwner('paylink-elsewhere')
    expect((await stranger.c.del(`/api/invoices/${inv.id}/pay-link`)).status).toBe(404)
    expect((await anonymous().del(`/api/invoices/${inv.id}/pay-link`)).status).toBe(401)
    const revoke = await desk.del(`/api/invoices/${inv.id}/pay-link`)
    expect(revoke.body).toEqual({ revoked: 1 })
    expect((await anonymous().get(`/api/pay/${newToken}`)).status).toBe(404)
    expect((await anonymous().post(`/api/pay/${newToken}/pay`)).status).toBe(404)
  })

  it('is not issued for an estimate or a draft, and a voided invoice\'s link stops working', async () => {
    const { email, job, inv } = await walkInInvoice(15)
    expect((await desk.post(`/api/invoices/${inv.id}/pay-link`)).status).toBe(409)
    const est = (await desk.post(`/api/jobs/${job.id}/invoices`, { kind: 'estimate' })).body
    await desk.patch(`/api/invoices/${est.id}`, { state: 'sent' })
    await waitForMail(email)
    expect(await sql('select id from pay_links where invoice_id = ?', [est.id])).toEqual([])
    await desk.patch(`/api/invoices/${inv.id}`, { state: 'sent' })
    const token = await mailedToken(email)
    await desk.patch(`/api/invoices/${inv.id}`, { state: 'void' })
    expect((await anonymous().get(`/api/pay/${token}`)).status).toBe(404)
  })
})

describe('payment at the counter', () => {
  it('the desk records cash for the invoice\'s total; the invoice is paid once, and only staff may', async () => {
    const { inv } = await walkInInvoice(45)
    expect((await tech.post(`/api/invoices/${inv.id}/counter-payment`, { method: 'cash', amountCents: inv.totalCents })).status).toBe(403)
    expect((await dana.post(`/api/invoices/${inv.id}/counter-payment`, { method: 'cash', amountCents: inv.totalCents })).status).toBe(403)
    expect((await desk.post(`/api/invoices/${inv.id}/counter-payment`, { method: 'cheque', amountCents: inv.totalCents })).status).toBe(400)
    const wrong = await desk.post(`/api/invoices/${inv.id}/counter-payment`, { method: 'cash', amountCents: inv.totalCents - 1 })
    expect(wrong.status).toBe(409)
    // A draft handed over the counter can be paid without sending it first.
    const paid = await desk.post(`/api/invoices/${inv.id}/counter-payment`, { method: 'cash', amountCents: inv.totalCents })
    expect(paid.status).toBe(200)
    expect(paid.body).toMatchObject({ state: 'paid', paidWith: 'cash' })
    expect(paid.body.paidAt).not.toBeNull()
    const again = await owner.post(`/api/invoices/${inv.id}/counter-payment`, { method: 'card', amountCents: inv.totalCents })
    expect(again.status).toBe(409)
    const rows = await sql('select method, status, amount_cents, recorded_by is not null as who from payments where invoice_id = ?', [inv.id])
    expect(rows).toEqual([{ method: 'cash', status: 'succeeded', amount_cents: inv.totalCents, who: 1 }])
  })
})

describe('shop settings', () => {
  it('the owner sets the name, contact and which e-mails go out; records and e-mails use them', async () => {
    const shop = await newOwner('settings')
    const bad = await shop.c.patch('/api/shop/settings', { email: 'not-an-address' })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toContain('enter a valid e-mail address')
    const r = await shop.c.patch('/api/shop/settings', { name: 'Elm Street Valve Bench', address: '2 Elm Street', phone: '555-0199', email: 'bench@elm.example', invoiceEmail: false })
    expect(r.status).toBe(200)
    expect(r.body).toMatchObject({ name: 'Elm Street Valve Bench', address: '2 Elm Street', invoiceEmail: false, readyEmail: true })
    expect((await shop.c.get('/api/auth/me')).body.activeShop.name).toBe('Elm Street Valve Bench')

    const email = `quiet-invoice-${randomUUID().slice(0, 8)}@test.example`
    const customer = (await shop.c.post('/api/customers', { name: 'Quiet', email })).body
    const amp = (await shop.c.post('/api/amps', { customerId: customer.id, description: '18 W two-EL84 combo, cathode biased' })).body
    const job = (await shop.c.post('/api/jobs', { customerId: customer.id, ampId: amp.id, complaint: 'Crackles' })).body
    await shop.c.post('/api/sync/push', {
      clientId: randomUUID(), shopId: shop.shopId, schemaVersion: SYNC_SCHEMA_VERSION,
      mutations: [{ id: 1, uuid: randomUUID(), name: 'jobLabour.create', args: { id: randomUUID(), jobId: job.id, minutes: 30, rateCents: 8000 } }],
    })
    const inv = (await shop.c.post(`/api/jobs/${job.id}/invoices`, { kind: 'invoice' })).body
    await shop.c.patch(`/api/invoices/${inv.id}`, { state: 'sent' })
    await shop.c.patch(`/api/jobs/${job.id}`, { status: 'on-bench' })
    await shop.c.patch(`/api/jobs/${job.id}`, { status: 'ready' })
    // The ready e-mail goes (switched on) and signs with the shop's contact; the invoice e-mail does not (switched off).
    const ready = await waitForMail(email)
    const text = ready.raw.replace(/=\r?\n/g, '')
    expect(text).toContain('Elm Street Valve Bench')
    expect(text).toContain('2 Elm Street')
    expect(text).toContain('555-0199')
    await new Promise(res => setTimeout(res, 800))
    expect(caughtMail().filter(m => m.to.includes(email) && m.raw.includes('Your invoice'))).toHaveLength(0)

    for (const c of [desk, tech, dana]) expect((await c.patch('/api/shop/settings', { name: 'Taken over' })).status).toBe(403)
  })
})
