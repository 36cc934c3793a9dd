// Every route file, called as anonymous, as each role of the demo shop, and as a member of another
// shop, against one table of expected answers. The answers come from the product's rules (the
// roles table in the brief and PERMISSIONS), not from what the server happens to say.
import { randomUUID } from 'node:crypto'
import { readdirSync } from 'node:fs'
import { beforeAll, describe, expect, it } from 'vitest'
import { can, type RecordKind, type Verb } from '../../shared/utils/permissions'
import type { Role } from '../../shared/utils/roles'
import { SYNC_SCHEMA_VERSION } from '../../shared/utils/sync/protocol'
import { BASE, client, DEMO, DEMO_PASSWORD, login, newOwner, type Client } from './helpers/client'
import { photo, putPhoto, RIG_REMINDER_SECRET, shopFixtures, signWebhook, tag } from './helpers/fixtures'

export const CALLERS = ['anon', 'owner', 'tech', 'desk', 'player', 'other'] as const
export type Caller = (typeof CALLERS)[number]
/** The role each signed-in caller has in the shop the request is about ("other" owns another shop). */
const ROLE_OF: Record<Exclude<Caller, 'anon' | 'other'>, Role> = { owner: 'owner', tech: 'tech', desk: 'desk', player: 'player' }

/** A request as the table builds it; the method comes from the route file's name. */
export interface Req { path: string, body?: unknown, raw?: Buffer | string, headers?: Record<string, string> }
export interface Case {
  /** What differs from the route's first case (a draft invoice, someone else's job...). */
  name?: string
  build: (x: Ctx, who: Caller) => Req | Promise<Req>
  /** Expected status per caller, in CALLERS order: anon, owner, tech, desk, player, other. */
  expect: readonly [number, number, number, number, number, number]
  /** The permission the route applies; the row is checked against PERMISSIONS too. */
  rule?: [RecordKind, Verb, { mine?: boolean }?]
  /** Sign the person in afresh for this call (signing out, or in again, on a device ends the session it had). */
  fresh?: boolean
}

// Demo ids (server/db/demo.ts).
const DANA_CUSTOMER = '6f1c2a10-0000-4000-8001-000000000001'
const DEMO_AMP = '6f1c2a10-0000-4000-8002-000000000001'
const DANA_SHARED_RIG = '6f1c2a10-0000-4000-8010-000000000001'
const DANA_PRIVATE_RIG = '6f1c2a10-0000-4000-8010-000000000002'
const DEMO_ID_PREFIX = '6f1c2a10-0000-4000-8'

interface Ctx {
  c: Record<Exclude<Caller, 'anon'>, Client>
  email: Record<Exclude<Caller, 'anon'>, string>
  /** Records of the demo shop, made by its owner. */
  demo: ReturnType<typeof shopFixtures>
  /** Records of the other caller's own shop, made by them. */
  mine: ReturnType<typeof shopFixtures>
  /** Shared records made once (only read or harmlessly edited by the rows). */
  ids: Record<string, string>
}

const shop = DEMO.shopId
const ok = (s: number) => s >= 200 && s < 300
const byCaller = (x: Ctx, who: Caller) => (who === 'anon' ? client() : x.c[who])
/** Fixtures of the shop the caller acts in (the demo shop for all but "other", whose shop is elsewhere). */
const own = (x: Ctx, who: Caller) => (who === 'other' ? x.mine : x.demo)

const everyone = (s: number) => [s, s, s, s, s, s] as const
const signedIn = (s: number) => [401, s, s, s, s, s] as const

/**
 * One row per route file under server/api (path relative to it). A route that is added without
 * a row here fails the first test; a row whose file is gone fails it too.
 */
export const ROUTES: Record<string, Case | Case[]> = {
  'amps/[id].delete.ts': { build: async x => ({ path: `/api/amps/${await x.demo.amp()}` }), expect: [401, 200, 403, 403, 403, 404], rule: ['amps', 'remove'] },
  'amps/[id].get.ts': { build: () => ({ path: `/api/amps/${DEMO_AMP}` }), expect: [401, 200, 200, 200, 403, 404], rule: ['amps', 'read'] },
  'amps/[id].patch.ts': { build: x => ({ path: `/api/amps/${x.ids.amp}`, body: { notes: `checked ${tag()}` } }), expect: [401, 200, 200, 200, 403, 404], rule: ['amps', 'update'] },
  'amps/index.get.ts': { build: () => ({ path: '/api/amps?q=LAW' }), expect: [401, 200, 200, 200, 403, 200], rule: ['amps', 'read'] },
  'amps/index.post.ts': { build: x => ({ path: '/api/amps', body: { customerId: x.ids.customer, description: 'two-EL84 combo' } }), expect: [401, 201, 201, 201, 403, 404], rule: ['amps', 'create'] },

  'auth/active-shop.post.ts': { build: () => ({ path: '/api/auth/active-shop', body: { shopId: shop } }), expect: [401, 200, 200, 200, 200, 404] },
  'auth/login.post.ts': { build: x => ({ path: '/api/auth/login', body: { email: x.ids.spareEmail, password: 'long-enough-password' } }), expect: everyone(200), fresh: true },
  'auth/logout.post.ts': { build: () => ({ path: '/api/auth/logout' }), expect: everyone(200), fresh: true },
  'auth/me.get.ts': { build: () => ({ path: '/api/auth/me' }), expect: signedIn(200) },
  // A wrong current password, so no demo password changes and no other session of the matrix ends.
  'auth/password.post.ts': { build: () => ({ path: '/api/auth/password', body: { currentPassword: 'not-the-password', newPassword: 'another-long-password' } }), expect: [401, 403, 403, 403, 403, 403] },
  'auth/register.post.ts': { build: () => ({ path: '/api/auth/register', body: { email: `new-${tag()}@test.example`, name: 'New person', password: 'long-enough-password' } }), expect: everyone(201), fresh: true },

  // Photos belong to the shop that holds them; any member may add one or open it.
  'blobs/[sha256].get.ts': { build: x => ({ path: `/api/blobs/${x.ids.photo}` }), expect: [401, 200, 200, 200, 200, 404] },
  'blobs/[sha256].put.ts': {
    build: () => {
      const p = photo()
      return { path: `/api/blobs/${p.sha256}`, raw: p.bytes, headers: { 'content-type': 'image/png' } }
    },
    expect: [401, 201, 201, 201, 201, 201],
  },

  'customers/[id].delete.ts': { build: async x => ({ path: `/api/customers/${await x.demo.customer()}` }), expect: [401, 200, 403, 403, 403, 404], rule: ['customers', 'remove'] },
  'customers/[id].get.ts': { build: () => ({ path: `/api/customers/${DANA_CUSTOMER}` }), expect: [401, 200, 200, 200, 403, 404], rule: ['customers', 'read'] },
  'customers/[id].patch.ts': { build: x => ({ path: `/api/customers/${x.ids.customer}`, body: { notes: `called ${tag()}` } }), expect: [401, 200, 403, 200, 403, 404], rule: ['customers', 'update'] },
  'customers/index.get.ts': { build: () => ({ path: '/api/customers?q=a' }), expect: [401, 200, 200, 200, 403, 200], rule: ['customers', 'read'] },
  'customers/index.post.ts': { build: () => ({ path: '/api/customers', body: { name: `Customer ${tag()}` } }), expect: [401, 201, 403, 201, 403, 201], rule: ['customers', 'create'] },

  'health.get.ts': { build: () => ({ path: '/api/health' }), expect: everyone(200) },

  // Public: the invitee may have no account yet.
  'invitations/[token].get.ts': { build: x => ({ path: `/api/invitations/${x.ids.inviteToken}` }), expect: everyone(200) },
  // Each signed-in caller accepts an invitation to their own address, for the role they already have.
  'invitations/[token]/accept.post.ts': {
    build: async (x, who) => {
      const role = who === 'anon' ? 'tech' : who === 'other' ? 'owner' : ROLE_OF[who]
      const { token } = await own(x, who).invitation(who === 'anon' ? undefined : x.email[who], role)
      return { path: `/api/invitations/${token}/accept` }
    },
    expect: signedIn(200),
  },

  'invoices/[id].get.ts': [
    { build: x => ({ path: `/api/invoices/${x.ids.danaInvoice}` }), expect: [401, 200, 200, 200, 200, 404], rule: ['invoices', 'read'] },
    // Players see only their own jobs' invoices, and only once sent.
    { name: 'a draft of the player\'s', build: x => ({ path: `/api/invoices/${x.ids.danaDraft}` }), expect: [401, 200, 200, 200, 404, 404] },
    { name: 'another customer\'s', build: x => ({ path: `/api/invoices/${x.ids.sentInvoice}` }), expect: [401, 200, 200, 200, 404, 404] },
  ],
  'invoices/[id].patch.ts': { build: async x => ({ path: `/api/invoices/${(await x.demo.invoice()).id}`, body: { state: 'sent' } }), expect: [401, 200, 403, 200, 403, 404], rule: ['invoices', 'update'] },
  'invoices/[id]/counter-payment.post.ts': {
    build: async (x) => {
      const inv = await x.demo.invoice({ sent: true })
      return { path: `/api/invoices/${inv.id}/counter-payment`, body: { method: 'cash', amountCents: inv.totalCents } }
    },
    expect: [401, 200, 403, 200, 403, 404],
    rule: ['invoices', 'update'],
  },
  'invoices/[id]/pay-link.delete.ts': { build: async x => ({ path: `/api/invoices/${(await x.demo.invoice({ sent: true })).id}/pay-link` }), expect: [401, 200, 403, 200, 403, 404], rule: ['invoices', 'update'] },
  'invoices/[id]/pay-link.get.ts': { build: x => ({ path: `/api/invoices/${x.ids.sentInvoice}/pay-link` }), expect: [401, 200, 403, 200, 403, 404], rule: ['invoices', 'update'] },
  'invoices/[id]/pay-link.post.ts': { build: async x => ({ path: `/api/invoices/${(await x.demo.invoice({ sent: true })).id}/pay-link` }), expect: [401, 201, 403, 201, 403, 404], rule: ['invoices', 'update'] },
  'invoices/[id]/pay.post.ts': [
    { build: async x => ({ path: `/api/invoices/${(await x.demo.invoice({ sent: true, customerId: DANA_CUSTOMER })).id}/pay` }), expect: [401, 202, 403, 202, 202, 404], rule: ['invoices', 'pay'] },
    { name: 'another customer\'s', build: async x => ({ path: `/api/invoices/${(await x.demo.invoice({ sent: true })).id}/pay` }), expect: [401, 202, 403, 202, 404, 404] },
  ],

  'jobs/[id].delete.ts': { build: async x => ({ path: `/api/jobs/${await x.demo.job()}` }), expect: [401, 200, 403, 403, 403, 404], rule: ['jobs', 'remove'] },
  'jobs/[id].get.ts': [
    { build: x => ({ path: `/api/jobs/${x.ids.danaJob}` }), expect: [401, 200, 200, 200, 200, 404], rule: ['jobs', 'read'] },
    { name: 'another customer\'s', build: x => ({ path: `/api/jobs/${x.ids.job}` }), expect: [401, 200, 200, 200, 404, 404] },
  ],
  'jobs/[id].patch.ts': { build: x => ({ path: `/api/jobs/${x.ids.job}`, body: { accessories: `cover ${tag()}` } }), expect: [401, 200, 200, 200, 403, 404], rule: ['jobs', 'update'] },
  'jobs/[id]/invoices.post.ts': { build: async x => ({ path: `/api/jobs/${(await x.demo.invoice()).jobId}/invoices`, body: { kind: 'estimate' } }), expect: [401, 201, 403, 201, 403, 404], rule: ['invoices', 'create'] },
  'jobs/index.get.ts': { build: () => ({ path: '/api/jobs?status=checked-in,on-bench' }), expect: signedIn(200), rule: ['jobs', 'read'] },
  'jobs/index.post.ts': { build: x => ({ path: '/api/jobs', body: { customerId: x.ids.customer, ampId: x.ids.amp, complaint: `Crackles ${tag()}` } }), expect: [401, 201, 403, 201, 403, 404], rule: ['jobs', 'create'] },

  'mail/index.get.ts': { build: () => ({ path: '/api/mail' }), expect: [401, 200, 403, 403, 403, 200], rule: ['mail', 'read'] },

  // Public: the token in the e-mailed link is the key.
  'pay/[token].get.ts': { build: x => ({ path: `/api/pay/${x.ids.payToken}` }), expect: everyone(200) },
  'pay/[token]/pay.post.ts': { build: async x => ({ path: `/api/pay/${await x.demo.payToken()}/pay` }), expect: everyone(202) },
  // Public: the provider's signature is the key.
  'payments/webhook.post.ts': [
    {
      build: () => {
        const payload = JSON.stringify({ id: `evt_${randomUUID()}`, object: 'event', type: 'customer.created', data: { object: {} } })
        return { path: '/api/payments/webhook', raw: payload, headers: { 'content-type': 'application/json', 'stripe-signature': signWebhook(payload) } }
      },
      expect: everyone(200),
    },
    { name: 'unsigned', build: () => ({ path: '/api/payments/webhook', raw: JSON.stringify({ id: `evt_${randomUUID()}`, type: 'customer.created' }), headers: { 'content-type': 'application/json' } }), expect: everyone(400) },
  ],

  'procedure-gates/index.post.ts': [
    { build: x => ({ path: '/api/procedure-gates', body: x.demo.gate() }), expect: [401, 201, 201, 403, 201, 201], rule: ['procedureGates', 'create'] },
    // Work on a job is the shop's: a player's checks are for their own amps (PRODUCT.md, roles).
    { name: 'on a job', build: x => ({ path: '/api/procedure-gates', body: x.demo.gate(randomUUID(), x.ids.danaJob) }), expect: [401, 201, 201, 403, 403, 404] },
  ],
  'procedure-runs/[id].get.ts': [
    { build: x => ({ path: `/api/procedure-runs/${x.ids.danaRun}` }), expect: [401, 200, 200, 200, 200, 404], rule: ['procedureRuns', 'read'] },
    { name: 'on another customer\'s job', build: x => ({ path: `/api/procedure-runs/${x.ids.run}` }), expect: [401, 200, 200, 200, 404, 404] },
  ],
  'procedure-runs/[id].patch.ts': [
    // The owner's run: techs and players may change only their own.
    // A player does not see a run on someone else's job at all.
    { build: x => ({ path: `/api/procedure-runs/${x.ids.run}`, body: { stepIndex: 1 } }), expect: [401, 200, 403, 403, 404, 404], rule: ['procedureRuns', 'update'] },
    {
      name: 'the caller\'s own run',
      build: async (x, who) => {
        const runner = who === 'anon' || who === 'desk' ? x.demo : shopFixtures(x.c[who], who === 'other' ? x.ids.otherShop : shop)
        return { path: `/api/procedure-runs/${await runner.run()}`, body: { stepIndex: 1 } }
      },
      expect: [401, 200, 200, 403, 200, 200],
      rule: ['procedureRuns', 'update', { mine: true }],
    },
  ],
  'procedure-runs/index.get.ts': { build: () => ({ path: '/api/procedure-runs' }), expect: signedIn(200), rule: ['procedureRuns', 'read'] },
  'procedure-runs/index.post.ts': {
    build: async (x, who) => {
      const gate = x.demo.gate()
      // The run's safety check is the caller's own (made first where their role may make one).
      if (who !== 'anon' && who !== 'desk') await x.c[who].post('/api/procedure-gates', gate)
      return { path: '/api/procedure-runs', body: { id: gate.runId, procedureId: gate.procedureId, gateId: gate.id, jobId: null, capCount: 3 } }
    },
    expect: [401, 201, 201, 403, 201, 201],
    rule: ['procedureRuns', 'create'],
  },

  // A rig is the player's; the shop's staff see it only while it is shared with the shop.
  'rigs/[id].get.ts': [
    { build: () => ({ path: `/api/rigs/${DANA_SHARED_RIG}` }), expect: [401, 200, 200, 200, 200, 404] },
    { name: 'not shared', build: () => ({ path: `/api/rigs/${DANA_PRIVATE_RIG}` }), expect: [401, 404, 404, 404, 200, 404] },
  ],
  'rigs/index.get.ts': { build: () => ({ path: '/api/rigs' }), expect: signedIn(200) },
  // Only with the task secret; without it the route does not exist.
  'rigs/reminders/run.post.ts': [
    { build: () => ({ path: '/api/rigs/reminders/run', body: { userId: randomUUID() }, headers: { 'x-task-secret': RIG_REMINDER_SECRET } }), expect: everyone(200) },
    { name: 'without the secret', build: () => ({ path: '/api/rigs/reminders/run', body: { userId: randomUUID() } }), expect: everyone(404) },
  ],

  'shop/settings.get.ts': { build: () => ({ path: '/api/shop/settings' }), expect: signedIn(200), rule: ['shopSettings', 'read'] },
  'shop/settings.patch.ts': { build: () => ({ path: '/api/shop/settings', body: { readyEmail: true } }), expect: [401, 200, 403, 403, 403, 200], rule: ['shopSettings', 'update'] },

  'shops/[shopId]/invitations/[invitationId].delete.ts': { build: async x => ({ path: `/api/shops/${shop}/invitations/${(await x.demo.invitation()).id}` }), expect: [401, 200, 403, 403, 403, 404], rule: ['invitations', 'remove'] },
  'shops/[shopId]/invitations/index.get.ts': { build: () => ({ path: `/api/shops/${shop}/invitations` }), expect: [401, 200, 403, 403, 403, 404], rule: ['invitations', 'read'] },
  'shops/[shopId]/invitations/index.post.ts': { build: () => ({ path: `/api/shops/${shop}/invitations`, body: { email: `invitee-${tag()}@test.example`, role: 'desk' } }), expect: [401, 201, 403, 403, 403, 404], rule: ['invitations', 'create'] },
  'shops/[shopId]/members/[userId].delete.ts': { build: async x => ({ path: `/api/shops/${shop}/members/${await x.demo.member()}` }), expect: [401, 200, 403, 403, 403, 404], rule: ['members', 'remove'] },
  'shops/[shopId]/members/[userId].patch.ts': { build: async x => ({ path: `/api/shops/${shop}/members/${await x.demo.member()}`, body: { role: 'desk' } }), expect: [401, 200, 403, 403, 403, 404], rule: ['members', 'update'] },
  'shops/[shopId]/members/index.get.ts': { build: () => ({ path: `/api/shops/${shop}/members` }), expect: [401, 200, 200, 200, 403, 404], rule: ['members', 'read'] },
  'shops/index.post.ts': { build: () => ({ path: '/api/shops', body: { name: `Shop ${tag()}` } }), expect: signedIn(201) },

  'stock/index.get.ts': { build: () => ({ path: '/api/stock' }), expect: [401, 200, 200, 200, 403, 200], rule: ['tubeLots', 'read'] },
  'stock/lots/[id].delete.ts': { build: async x => ({ path: `/api/stock/lots/${await x.demo.lot()}` }), expect: [401, 200, 200, 403, 403, 404], rule: ['tubeLots', 'remove'] },
  'stock/lots/[id].patch.ts': { build: x => ({ path: `/api/stock/lots/${x.ids.lot}`, body: { notes: `burned in ${tag()}` } }), expect: [401, 200, 200, 403, 403, 404], rule: ['tubeLots', 'update'] },
  'stock/lots/index.post.ts': { build: () => ({ path: '/api/stock/lots', body: { tubeType: 'el84', maker: `Lot ${tag()}`, costCents: 1200 } }), expect: [401, 201, 201, 403, 403, 201], rule: ['tubeLots', 'create'] },
  'stock/sets/[id].delete.ts': { build: async x => ({ path: `/api/stock/sets/${(await x.demo.matchedSet()).setId}` }), expect: [401, 200, 200, 403, 403, 404], rule: ['matchedSets', 'remove'] },
  'stock/sets/[id].get.ts': { build: x => ({ path: `/api/stock/sets/${x.ids.set}` }), expect: [401, 200, 200, 200, 403, 404], rule: ['matchedSets', 'read'] },
  'stock/sets/[id].patch.ts': { build: x => ({ path: `/api/stock/sets/${x.ids.set}`, body: { label: `S-${tag().slice(0, 5)}` } }), expect: [401, 200, 200, 403, 403, 404], rule: ['matchedSets', 'update'] },
  'stock/sets/[id]/fit.post.ts': { build: async x => ({ path: `/api/stock/sets/${(await x.demo.matchedSet()).setId}/fit`, body: { jobId: await x.demo.job() } }), expect: [401, 200, 200, 403, 403, 404], rule: ['matchedSets', 'update'] },
  'stock/sets/[id]/return.post.ts': {
    build: async (x) => {
      const { setId } = await x.demo.matchedSet()
      const fit = await x.c.owner.post(`/api/stock/sets/${setId}/fit`, { jobId: await x.demo.job() })
      if (fit.status !== 200) throw new Error(`fitting the set answered ${fit.status}`)
      return { path: `/api/stock/sets/${setId}/return` }
    },
    expect: [401, 200, 200, 403, 403, 404],
    rule: ['matchedSets', 'update'],
  },
  'stock/sets/index.post.ts': {
    build: async (x) => {
      const setId = randomUUID()
      const lotId = await x.demo.lot()
      const tubeIds = [randomUUID(), randomUUID()]
      await x.demo.push(tubeIds.map((id, i) => ({ name: 'stockTube.create', args: { id, lotId, label: `Q${i}`, plateVolts: 400, gridVolts: -45, amps: 0.04, testedOn: '2026-01-01', setId } })))
      return { path: '/api/stock/sets', body: { id: setId, tubeType: '6l6gc', label: `S-${tag().slice(0, 5)}`, tubeIds, size: 2, spreadFraction: 0 } }
    },
    expect: [401, 201, 201, 403, 403, 404],
    rule: ['matchedSets', 'create'],
  },
  'stock/tubes/[id].delete.ts': { build: async x => ({ path: `/api/stock/tubes/${await x.demo.stockTube()}` }), expect: [401, 200, 200, 403, 403, 404], rule: ['stockTubes', 'remove'] },
  'stock/tubes/[id].patch.ts': { build: x => ({ path: `/api/stock/tubes/${x.ids.stockTube}`, body: { testedBy: `Tester ${tag()}` } }), expect: [401, 200, 200, 403, 403, 404], rule: ['stockTubes', 'update'] },
  'stock/tubes/index.post.ts': { build: x => ({ path: '/api/stock/tubes', body: { lotId: x.ids.lot, label: 'N1', plateVolts: 400, gridVolts: -45, amps: 0.04, testedOn: '2026-01-01' } }), expect: [401, 201, 201, 403, 403, 404], rule: ['stockTubes', 'create'] },

  'sync/pull.post.ts': { build: () => ({ path: '/api/sync/pull', body: { clientId: randomUUID(), shopId: shop, schemaVersion: SYNC_SCHEMA_VERSION, cookie: null } }), expect: [401, 200, 200, 200, 200, 404] },
  'sync/push.post.ts': { build: () => ({ path: '/api/sync/push', body: { clientId: randomUUID(), shopId: shop, schemaVersion: SYNC_SCHEMA_VERSION, mutations: [] } }), expect: [401, 200, 200, 200, 200, 404] },

  'tubes/[id].delete.ts': { build: async x => ({ path: `/api/tubes/${await x.demo.shopTube()}` }), expect: [401, 200, 200, 403, 403, 404], rule: ['tubes', 'remove'] },
  'tubes/[id].patch.ts': { build: x => ({ path: `/api/tubes/${x.ids.shopTube}`, body: { source: `Data sheet ${tag()}` } }), expect: [401, 200, 200, 403, 403, 404], rule: ['tubes', 'update'] },
  'tubes/index.get.ts': { build: () => ({ path: '/api/tubes' }), expect: signedIn(200), rule: ['tubes', 'read'] },
  'tubes/index.post.ts': { build: () => ({ path: '/api/tubes', body: { name: `Tube ${tag()}`, maxPlateWatts: 12, maxPlateVolts: 300, heater: '6.3 V 0.76 A', ratingSystem: 'design-maximum', source: 'Test data sheet' } }), expect: [401, 201, 201, 403, 403, 201], rule: ['tubes', 'create'] },
}

const METHOD: Record<string, string> = { get: 'GET', post: 'POST', put: 'PUT', patch: 'PATCH', delete: 'DELETE' }
/** The method and the URL pattern a route file answers, from its name. */
export function routeOf(file: string) {
  const m = /^(.*)\.(get|post|put|patch|delete)\.ts$/.exec(file)
  if (!m) throw new Error(`${file}: not a route file name`)
  const pattern = `/api/${m[1]}`.replace(/\/index$/, '').replace(/\[[^\]]+\]/g, '[^/?]+')
  return { method: METHOD[m[2]!]!, pattern: new RegExp(`^${pattern}(\\?.*)?$`) }
}

export const ROUTE_FILES = readdirSync('server/api', { recursive: true, encoding: 'utf8' }).map(f => f.split('\\').join('/')).filter(f => f.endsWith('.ts')).sort()

export async function send(c: Client, method: string, req: Req) {
  if (req.raw === undefined && !req.headers) return c.raw(method, req.path, req.body)
  const body = req.raw ?? JSON.stringify(req.body ?? {})
  const res = await fetch(BASE + req.path, {
    method,
    headers: { 'content-type': 'application/json', 'content-length': String(Buffer.byteLength(body)), ...(c.cookie ? { cookie: c.cookie } : {}), ...req.headers },
    body,
  })
  const text = await res.text()
  let parsed: unknown = text
  try {
    parsed = JSON.parse(text)
  }
  catch { /* not JSON */ }
  return { status: res.status, body: parsed as any, headers: res.headers }
}

let x: Ctx

beforeAll(async () => {
  const [owner, tech, desk, player] = await Promise.all([DEMO.owner, DEMO.tech, DEMO.desk, DEMO.dana].map(e => login(e)))
  const other = await newOwner('matrix-elsewhere')
  const demo = shopFixtures(owner, shop)
  const spareEmail = `spare-${tag()}@test.example`
  const spare = await client().post('/api/auth/register', { email: spareEmail, name: 'Spare person', password: 'long-enough-password' })
  expect(spare.status).toBe(201)
  const danaJob = await demo.job(DANA_CUSTOMER)
  const customer = await demo.customer()
  const [amp, job, danaInvoice, danaDraft, sentInvoice, lot, set, shopTube, invite, shot] = await Promise.all([
    demo.amp(customer), demo.job(), demo.invoice({ customerId: DANA_CUSTOMER, sent: true }), demo.invoice({ customerId: DANA_CUSTOMER }),
    demo.invoice({ sent: true }), demo.lot(), demo.matchedSet(), demo.shopTube(), demo.invitation(), putPhoto(owner),
  ])
  expect(shot.status).toBe(201)
  const [stockTube, payToken, danaRun, run] = await Promise.all([demo.stockTube(lot), demo.payToken(sentInvoice.id), demo.run(danaJob), demo.run(job)])
  x = {
    c: { owner, tech, desk, player, other: other.c },
    email: { owner: DEMO.owner, tech: DEMO.tech, desk: DEMO.desk, player: DEMO.dana, other: other.email },
    demo,
    mine: shopFixtures(other.c, other.shopId),
    ids: {
      otherShop: other.shopId, spareEmail, danaJob, customer, amp, job, danaInvoice: danaInvoice.id, danaDraft: danaDraft.id,
      sentInvoice: sentInvoice.id, lot, set: set.setId, shopTube, inviteToken: invite.token, photo: shot.sha256, stockTube, payToken, danaRun, run,
    },
  }
}, 120_000)

describe('the role matrix', () => {
  it('has exactly one row per route file under server/api', () => {
    const missing = ROUTE_FILES.filter(f => !(f in ROUTES))
    const gone = Object.keys(ROUTES).filter(f => !ROUTE_FILES.includes(f))
    expect(missing, 'route files with no row in ROUTES').toEqual([])
    expect(gone, 'rows in ROUTES whose file is gone').toEqual([])
  })

  it('agrees with PERMISSIONS wherever a row names the permission it applies', () => {
    const disagree: string[] = []
    for (const [file, row] of Object.entries(ROUTES)) {
      for (const c of [row].flat()) {
        if (!c.rule) continue
        const [record, verb, opts] = c.rule
        for (const [who, role] of Object.entries(ROLE_OF)) {
          const expected = c.expect[CALLERS.indexOf(who as Caller)]!
          if (ok(expected) !== can(role, record, verb, opts)) disagree.push(`${file}${c.name ? ` (${c.name})` : ''}: ${who} expects ${expected}`)
        }
        if (c.expect[0] !== 401) disagree.push(`${file}: anonymous must get 401`)
      }
    }
    expect(disagree).toEqual([])
  })

  it.concurrent.each(Object.entries(ROUTES).flatMap(([file, row]) => [row].flat().map(c => ({ file, c, label: `${file}${c.name ? ` (${c.name})` : ''}` }))))('$label', async ({ file, c }) => {
    const { method, pattern } = routeOf(file)
    const got: Record<string, number> = {}
    const leaks: string[] = []
    const isPublic = c.expect.every(s => s === c.expect[0])
    for (const who of CALLERS) {
      const req = await c.build(x, who)
      expect(req.path, `${file}: the row builds a path this route answers`).toMatch(pattern)
      // A copy of the caller's cookie, so a route that changes the session leaves the caller as they were.
      const caller = who === 'anon' ? client() : c.fresh ? await login(who === 'other' ? x.email.other : x.email[who], who === 'other' ? 'correct-horse-battery' : DEMO_PASSWORD) : client(BASE, byCaller(x, who).cookie)
      const r = await send(caller, method, req)
      got[who] = r.status
      // Nothing of the demo shop reaches a member of another shop (beyond the ids they sent).
      const sentIds = JSON.stringify(req).match(/[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}/g) ?? []
      const text = sentIds.reduce((t, id) => t.split(id).join(''), typeof r.body === 'string' ? r.body : JSON.stringify(r.body))
      if (who === 'other' && !isPublic && text.includes(DEMO_ID_PREFIX)) leaks.push(text.slice(0, 200))
    }
    expect(got).toEqual(Object.fromEntries(CALLERS.map((w, i) => [w, c.expect[i]])))
    expect(leaks).toEqual([])
  })
})
