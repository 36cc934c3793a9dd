// Fresh records for route tests, made through the API by someone allowed to make them, so a
// test that edits or deletes one never spoils the demo shop for other suites.
import { createHash, createHmac, randomUUID } from 'node:crypto'
import { SYNC_SCHEMA_VERSION } from '../../../shared/utils/sync/protocol'
import { setSpread } from '../../../shared/utils/bench/set-spread'
import { findProcedure } from '../../../shared/utils/procedures/index'
import { BASE, client, type Client, type Reply } from './client'

const APP_ENV = JSON.parse(process.env.TW_TEST_APP_ENV ?? '{}') as Record<string, string>
export const WEBHOOK_SECRET = APP_ENV.NUXT_PAYMENT_WEBHOOK_SECRET ?? ''
export const RIG_REMINDER_SECRET = process.env.TW_TEST_RIG_REMINDER_SECRET ?? ''

export const tag = () => randomUUID().slice(0, 8)
const must = <T = any>(r: Reply<T>, status: number, what: string): T => {
  if (r.status !== status) throw new Error(`${what} answered ${r.status}: ${JSON.stringify(r.body).slice(0, 300)}`)
  return r.body
}

/** The webhook signature scheme of the payment provider (`t=...,v1=hmac`). */
export const signWebhook = (payload: string, secret = WEBHOOK_SECRET, t = Math.floor(Date.now() / 1000)) =>
  `t=${t},v1=${createHmac('sha256', secret).update(`${t}.${payload}`).digest('hex')}`

// Source: PNG signature, ISO/IEC 15948 section 5.2 (the server sniffs only the signature).
const PNG_SIGNATURE = Buffer.from([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A])
/** A distinct small "photo" and its address. */
export function photo() {
  const bytes = Buffer.concat([PNG_SIGNATURE, Buffer.from(randomUUID())])
  return { bytes, sha256: createHash('sha256').update(bytes).digest('hex') }
}

export async function putPhoto(c: Client, p = photo()) {
  const res = await fetch(`${BASE}/api/blobs/${p.sha256}`, { method: 'PUT', headers: { 'content-type': 'image/png', 'content-length': String(p.bytes.length), cookie: c.cookie }, body: p.bytes })
  return { status: res.status, ...p }
}

/** Records of one shop, made by `staff` (an owner: allowed everything). */
export function shopFixtures(staff: Client, shopId: string) {
  const push = async (mutations: { name: string, args: unknown }[]) => {
    const r = await staff.post('/api/sync/push', {
      clientId: randomUUID(), shopId, schemaVersion: SYNC_SCHEMA_VERSION,
      mutations: mutations.map((m, i) => ({ id: i + 1, uuid: randomUUID(), ...m })),
    })
    const results = must(r, 200, 'push').results as { status: string, reason?: string }[]
    const bad = results.find(x => x.status !== 'applied')
    if (bad) throw new Error(`push: ${JSON.stringify(bad)}`)
  }
  const f = {
    push,
    customer: async (extra: Record<string, unknown> = {}) => must(await staff.post('/api/customers', { name: `Customer ${tag()}`, ...extra }), 201, 'customer').id as string,
    amp: async (customerId?: string) => must(await staff.post('/api/amps', { customerId: customerId ?? await f.customer(), description: 'two-6V6 combo, fixed bias', serial: `T-${tag()}` }), 201, 'amp').id as string,
    job: async (customerId?: string) => {
      const cid = customerId ?? await f.customer()
      return must(await staff.post('/api/jobs', { customerId: cid, ampId: await f.amp(cid), complaint: `Hum at idle ${tag()}` }), 201, 'job').id as string
    },
    /** An invoice with one labour line, drafted or sent. */
    invoice: async (opts: { customerId?: string, sent?: boolean, kind?: 'invoice' | 'estimate' } = {}) => {
      const jobId = await f.job(opts.customerId)
      await push([{ name: 'jobLabour.create', args: { id: randomUUID(), jobId, minutes: 30, rateCents: 9000 } }])
      const inv = must(await staff.post(`/api/jobs/${jobId}/invoices`, { kind: opts.kind ?? 'invoice' }), 201, 'invoice')
      if (opts.sent) must(await staff.patch(`/api/invoices/${inv.id}`, { state: 'sent' }), 200, 'send invoice')
      return { id: inv.id as string, jobId, totalCents: inv.totalCents as number }
    },
    /** A sent invoice's pay-link token. */
    payToken: async (invoiceId?: string) => {
      const id = invoiceId ?? (await f.invoice({ sent: true })).id
      return (must(await staff.post(`/api/invoices/${id}/pay-link`), 201, 'pay link').url as string).split('/pay/')[1]!
    },
    lot: async () => must(await staff.post('/api/stock/lots', { tubeType: '6l6gc', maker: `Lot ${tag()}`, costCents: 2000 }), 201, 'lot').id as string,
    stockTube: async (lotId?: string) => must(await staff.post('/api/stock/tubes', { lotId: lotId ?? await f.lot(), label: `T${tag().slice(0, 4)}`, plateVolts: 400, gridVolts: -45, amps: 0.04, testedOn: new Date().toISOString().slice(0, 10) }), 201, 'stock tube').id as string,
    /** A matched pair in stock: its tubes name the set first, then the set. */
    matchedSet: async () => {
      const setId = randomUUID()
      const lotId = randomUUID()
      const tubeIds = [randomUUID(), randomUUID()]
      const mA = [40, 41]
      await push([
        { name: 'tubeLot.create', args: { id: lotId, tubeType: '6l6gc', maker: 'Test lot', costCents: 2000 } },
        ...tubeIds.map((id, i) => ({ name: 'stockTube.create', args: { id, lotId, label: `P${i + 1}`, plateVolts: 400, gridVolts: -45, amps: mA[i]! / 1000, testedOn: new Date().toISOString().slice(0, 10), setId } })),
        { name: 'matchedSet.create', args: { id: setId, tubeType: '6l6gc', label: `S-${tag().slice(0, 5)}`, tubeIds, size: 2, spreadFraction: setSpread(mA.map(m => m / 1000)) } },
      ])
      return { setId, tubeIds, lotId }
    },
    shopTube: async () => must(await staff.post('/api/tubes', { name: `Test tube ${tag()}`, maxPlateWatts: 25, maxScreenWatts: null, maxPlateVolts: 500, heater: '6.3 V 0.9 A', ratingSystem: 'design-centre', source: 'Test data sheet' }), 201, 'shop tube').id as string,
    invitation: async (email = `invitee-${tag()}@test.example`, role = 'tech') => {
      const r = must(await staff.post(`/api/shops/${shopId}/invitations`, { email, role }), 201, 'invitation')
      return { id: r.id as string, token: (r.link as string).split('/invite/')[1]! }
    },
    /** A new member (registered through an invitation): their user id. */
    member: async (role = 'tech') => {
      const email = `member-${tag()}@test.example`
      const { token } = await f.invitation(email, role)
      const r = await client().post('/api/auth/register', { email, name: `Member ${tag()}`, password: 'long-enough-password', invitationToken: token })
      return must(r, 201, 'register member').user.id as string
    },
    /** A safety check for a new run (the run must be started by whoever acknowledged it); the backstage check is open to players too. */
    gate: (runId = randomUUID(), jobId: string | null = null, procedureId = 'backstage-check') => ({
      id: randomUUID(), runId, procedureId, jobId, items: findProcedure(procedureId)!.gate.map(g => g.id), acknowledgedAt: new Date().toISOString(),
    }),
    run: async (jobId: string | null = null) => {
      const gate = f.gate(randomUUID(), jobId)
      must(await staff.post('/api/procedure-gates', gate), 201, 'gate')
      must(await staff.post('/api/procedure-runs', { id: gate.runId, procedureId: gate.procedureId, gateId: gate.id, jobId, capCount: 3 }), 201, 'run')
      return gate.runId
    },
  }
  return f
}
