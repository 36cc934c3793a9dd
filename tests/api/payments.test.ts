import { createHmac, randomUUID } from 'node:crypto'
import { beforeAll, describe, expect, it } from 'vitest'
import { SYNC_SCHEMA_VERSION } from '../../shared/utils/sync/protocol'
import { BASE, client, DEMO, login, newOwner, type Client } from './helpers/client'
import { sql } from './helpers/db'
import { caughtMail, waitForMail } from './helpers/mail'

const appEnv = JSON.parse(process.env.TW_TEST_APP_ENV ?? '{}') as Record<string, string>
const WEBHOOK_SECRET = appEnv.NUXT_PAYMENT_WEBHOOK_SECRET ?? ''
const FAKE = process.env.TW_TEST_PAYMENT_URL ?? ''
const DANA_EMAIL = 'dana@players.example'

let owner: Client, desk: Client, tech: Client, dana: Client, sam: Client

beforeAll(async () => {
  [owner, desk, tech, dana, sam] = await Promise.all([DEMO.owner, DEMO.desk, DEMO.tech, DEMO.dana, DEMO.sam].map(e => login(e)))
})

/** A sent invoice on a new job of Dana's (the player linked to the customer record). */
async function sentInvoiceForDana(minutes: number) {
  const danaCustomer = (await desk.get(`/api/customers?q=${DANA_EMAIL}`)).body.items[0]
  const amp = (await desk.post('/api/amps', { customerId: danaCustomer.id, description: '18 W two-EL84 combo, cathode biased', serial: `PAY-${randomUUID().slice(0, 6)}` })).body
  const job = (await desk.post('/api/jobs', { customerId: danaCustomer.id, ampId: amp.id, complaint: 'Set the bias' })).body
  const r = await owner.post('/api/sync/push', {
    clientId: randomUUID(), shopId: DEMO.shopId, schemaVersion: SYNC_SCHEMA_VERSION,
    mutations: [{ id: 1, uuid: randomUUID(), name: 'jobLabour.create', args: { id: randomUUID(), jobId: job.id, minutes, rateCents: 9000 } }],
  })
  expect(r.body.results[0].status).toBe('applied')
  const inv = (await desk.post(`/api/jobs/${job.id}/invoices`, { kind: 'invoice' })).body
  return { job, inv, send: () => desk.patch(`/api/invoices/${inv.id}`, { state: 'sent' }) }
}

async function untilPaid(c: Client, id: string) {
  const deadline = Date.now() + 10_000
  for (;;) {
    const r = await c.get(`/api/invoices/${id}`)
    if (r.body.state === 'paid') return r.body
    if (Date.now() > deadline) throw new Error(`invoice ${id} still ${r.body.state}`)
    await new Promise(res => setTimeout(res, 100))
  }
}

const sign = (payload: string, secret = WEBHOOK_SECRET, t = Math.floor(Date.now() / 1000)) =>
  `t=${t},v1=${createHmac('sha256', secret).update(`${t}.${payload}`).digest('hex')}`
const postWebhook = (payload: string, signature?: string) =>
  fetch(`${BASE}/api/payments/webhook`, { method: 'POST', headers: { 'content-type': 'application/json', ...(signature ? { 'stripe-signature': signature } : {}) }, body: payload })

const paymentMails = (number: number) => caughtMail().filter(m => m.to.includes(DANA_EMAIL) && m.raw.includes(`Payment received for invoice no. ${number}\r\n`))
const state = async (invoiceId: string) => {
  const [inv] = await sql('select state, version, paid_at from invoices where id = ?', [invoiceId])
  const pays = await sql('select id, status, amount_cents from payments where invoice_id = ? order by created_at', [invoiceId])
  const mail = await sql('select count(*) n from sent_mail where subject = (select concat(\'Payment received for invoice no. \', number) from invoices where id = ?)', [invoiceId])
  return { inv, pays, mails: Number(mail[0].n) }
}

describe('paying an invoice', () => {
  it('the player pays, the provider\'s webhook marks the invoice paid once and mails a receipt', async () => {
    const { inv, send } = await sentInvoiceForDana(60)
    // Only a sent invoice can be paid.
    expect((await dana.post(`/api/invoices/${inv.id}/pay`)).status).toBe(404)
    expect((await desk.post(`/api/invoices/${inv.id}/pay`)).status).toBe(409)
    expect((await send()).status).toBe(200)
    expect((await tech.post(`/api/invoices/${inv.id}/pay`)).status).toBe(403)
    expect((await sam.post(`/api/invoices/${inv.id}/pay`)).status).toBe(404)

    const r = await dana.post(`/api/invoices/${inv.id}/pay`)
    expect(r.status).toBe(202)
    expect(r.body).toEqual({ paymentId: expect.any(String), status: 'pending' })
    const paid = await untilPaid(dana, inv.id)
    expect(paid.paidAt).not.toBeNull()
    expect(paid.version).toBeGreaterThan(inv.version)
    // Source: arithmetic, worked by hand: 60 min at 9000 /h = 9 000; 8.25 % = 742.5 -> 743; total 9 743.
    expect(paid.payments).toEqual([expect.objectContaining({ id: r.body.paymentId, status: 'succeeded', amountCents: 9743 })])
    const [intent] = await sql('select provider_intent_id from payments where id = ?', [r.body.paymentId])
    expect(intent.provider_intent_id).toMatch(/^pi_/)

    await waitForMail(DANA_EMAIL)
    await expect.poll(() => paymentMails(inv.number).length, { timeout: 5000 }).toBe(1)
    // Paying again is refused.
    expect((await dana.post(`/api/invoices/${inv.id}/pay`)).status).toBe(409)
  })

  it('a replayed or repeated event changes nothing and sends no second receipt', async () => {
    const { inv, send } = await sentInvoiceForDana(30)
    await send()
    const r = await owner.post(`/api/invoices/${inv.id}/pay`)
    expect(r.status).toBe(202)
    await untilPaid(owner, inv.id)
    await expect.poll(() => paymentMails(inv.number).length, { timeout: 5000 }).toBe(1)
    const before = await state(inv.id)
    expect(before.mails).toBe(1)

    const [p] = await sql('select provider_intent_id from payments where id = ?', [r.body.paymentId])
    const fake = await fetch(`${FAKE}/_fake/deliveries`, { headers: { authorization: `Bearer ${appEnv.NUXT_PAYMENT_SECRET_KEY}` } })
    const delivery = (await fake.json()).deliveries.find((d: { payload: string }) => d.payload.includes(p.provider_intent_id))
    expect(delivery).toBeDefined()
    // The same delivery, five times at once.
    const replays = await Promise.all(Array.from({ length: 5 }, () => postWebhook(delivery.payload, delivery.signature)))
    expect(replays.map(x => x.status)).toEqual([200, 200, 200, 200, 200])
    expect(await Promise.all(replays.map(x => x.json()))).toEqual(replays.map(() => ({ received: true, duplicate: true })))
    // A new event id for the same payment, correctly signed.
    const again = JSON.stringify({ ...JSON.parse(delivery.payload), id: `evt_${randomUUID().replace(/-/g, '')}` })
    expect((await postWebhook(again, sign(again))).status).toBe(200)
    await new Promise(res => setTimeout(res, 500))
    expect(await state(inv.id)).toEqual(before)
    expect(paymentMails(inv.number)).toHaveLength(1)
  })

  it('refuses a webhook with a bad, missing, stale or foreign signature (400) and changes nothing', async () => {
    const { inv, send } = await sentInvoiceForDana(15)
    await send()
    // A payment row as if the card form had been filled in but not confirmed.
    const paymentId = randomUUID()
    const intentId = `pi_test_${randomUUID().replace(/-/g, '')}`
    await sql('insert into payments (id, shop_id, invoice_id, provider_intent_id, amount_cents, status) values (?, ?, ?, ?, ?, \'pending\')', [paymentId, DEMO.shopId, inv.id, intentId, inv.totalCents])
    const payload = JSON.stringify({ id: `evt_${randomUUID().replace(/-/g, '')}`, object: 'event', type: 'payment_intent.succeeded', data: { object: { id: intentId, object: 'payment_intent', amount: inv.totalCents, currency: 'usd', metadata: {} } } })
    const before = await state(inv.id)
    for (const signature of [undefined, 'nonsense', sign(payload, 'whsec_someone_else'), sign(payload, WEBHOOK_SECRET, Math.floor(Date.now() / 1000) - 3600), sign(payload.replace('"amount"', '"amount_x"'))]) {
      const res = await postWebhook(payload, signature)
      expect(res.status, String(signature)).toBe(400)
      expect(JSON.stringify(await res.json())).not.toMatch(/stack/i)
    }
    expect(await state(inv.id)).toEqual(before)
    const events = await sql('select count(*) n from webhook_events where id = ?', [JSON.parse(payload).id])
    expect(Number(events[0].n)).toBe(0)
    // The same event correctly signed is accepted, which shows the refusals were about the signature.
    expect((await postWebhook(payload, sign(payload))).status).toBe(200)
    expect((await untilPaid(desk, inv.id)).state).toBe('paid')
  })

  it('will not pay an estimate, and another shop cannot see the invoice', async () => {
    const { job } = await sentInvoiceForDana(10)
    const est = (await desk.post(`/api/jobs/${job.id}/invoices`, { kind: 'estimate' })).body
    await desk.patch(`/api/invoices/${est.id}`, { state: 'sent' })
    expect((await dana.post(`/api/invoices/${est.id}/pay`)).status).toBe(400)
    expect((await client().post(`/api/invoices/${est.id}/pay`)).status).toBe(401)
    const stranger = await newOwner('pay-elsewhere')
    expect((await stranger.c.get(`/api/invoices/${est.id}`)).status).toBe(404)
    expect((await stranger.c.post(`/api/invoices/${est.id}/pay`)).status).toBe(404)
    expect((await stranger.c.patch(`/api/invoices/${est.id}`, { state: 'void' })).status).toBe(404)
  })
})
