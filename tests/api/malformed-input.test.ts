// Generated bad input for every route that reads a body, query or path parameters: never a 5xx,
// never a stack trace or SQL in the reply, and nothing written. Everything happens in a shop of
// its own, so the other suites running at the same time do not move its counts.
import { readdirSync, readFileSync } from 'node:fs'
import { randomUUID } from 'node:crypto'
import fc from 'fast-check'
import { beforeAll, describe, expect, it } from 'vitest'
import { SYNC_SCHEMA_VERSION } from '../../shared/utils/sync/protocol'
import { BASE, DEMO, newOwner, type Client } from './helpers/client'
import { sql } from './helpers/db'
import { photo, putPhoto, RIG_REMINDER_SECRET, shopFixtures, signWebhook } from './helpers/fixtures'

const RUNS = Number(process.env.TW_FUZZ_RUNS ?? 200)
const POOL = 6
const SEED = Number(process.env.TW_FUZZ_SEED ?? Date.now() % 2 ** 31)
/** Only the routes whose file name contains this (to dig into one route with more runs). */
const ONLY = process.env.TW_FUZZ_ONLY ?? ''

type Body = Record<string, unknown>
interface Target {
  /** The path with valid parameters (records of the throwaway shop). */
  path: (s: Fx) => string
  /** A valid query, whose values the generator spoils one at a time. */
  query?: Record<string, string>
  /** A valid body, whose fields the generator spoils one at a time. */
  body?: (s: Fx) => Body
  /** Free-text fields: any string is fine there, so only wrong types and oversize text go in. */
  free?: string[]
  /** Id fields pointing at records: another shop's id there must be refused. */
  refs?: string[]
  headers?: Record<string, string>
  /** The body is raw bytes (photos, the webhook), spoiled as a whole. */
  raw?: 'photo' | 'webhook'
  /** An empty object is a valid body (every field optional): junk that parses to an object is left out. */
  emptyOk?: boolean
}

/** Routes that read no body, query or parameters (or, for logout, whose only effect is on the caller). */
const NO_INPUT = ['auth/logout.post.ts', 'auth/me.get.ts', 'health.get.ts', 'mail/index.get.ts', 'rigs/index.get.ts', 'shop/settings.get.ts', 'stock/index.get.ts', 'tubes/index.get.ts']

const DEMO_JOB = '6f1c2a10-0000-4000-8003-000000000001'
const DEMO_CUSTOMER = '6f1c2a10-0000-4000-8001-000000000001'
const DEMO_LOT = '6f1c2a10-0000-4000-8020-000000000001'
const today = new Date().toISOString().slice(0, 10)
const gateItems = ['drained', 'meter-checked']

const TARGETS: Record<string, Target> = {
  'amps/[id].delete.ts': { path: s => `/api/amps/${s.amp}` },
  'amps/[id].get.ts': { path: s => `/api/amps/${s.amp}` },
  'amps/[id].patch.ts': { path: s => `/api/amps/${s.amp}`, body: () => ({ notes: 'n', powerTubeCount: 2, biasMode: 'fixed' }), free: ['notes'] },
  'amps/index.get.ts': { path: () => '/api/amps', query: { q: 'a', page: '1', pageSize: '10', customer: randomUUID() }, free: ['q'] },
  'amps/index.post.ts': { path: () => '/api/amps', body: s => ({ customerId: s.customer, description: 'combo', powerTubeCount: 2, biasMode: 'fixed' }), free: ['description'], refs: ['customerId'] },
  'auth/active-shop.post.ts': { path: () => '/api/auth/active-shop', body: s => ({ shopId: s.shopId }), refs: ['shopId'] },
  'auth/login.post.ts': { path: () => '/api/auth/login', body: () => ({ email: 'nobody@test.example', password: 'x' }), free: ['password'] },
  // The current password is wrong, so no spoiled body can change the owner's password.
  'auth/password.post.ts': { path: () => '/api/auth/password', body: () => ({ currentPassword: 'not-the-password', newPassword: 'another-long-password' }), free: ['currentPassword', 'newPassword'] },
  'auth/register.post.ts': { path: () => '/api/auth/register', body: () => ({ email: 'someone@test.example', name: 'Some One', password: 'long-enough-password', invitationToken: 'abcdefghijkl' }), free: ['name', 'password'] },
  'blobs/[sha256].get.ts': { path: s => `/api/blobs/${s.photo}` },
  'blobs/[sha256].put.ts': { path: () => `/api/blobs/${photo().sha256}`, raw: 'photo' },
  'customers/[id].delete.ts': { path: s => `/api/customers/${s.customer}` },
  'customers/[id].get.ts': { path: s => `/api/customers/${s.customer}` },
  'customers/[id].patch.ts': { path: s => `/api/customers/${s.customer}`, body: () => ({ name: 'N', email: 'a@test.example', notes: 'n' }), free: ['name', 'notes'] },
  'customers/index.get.ts': { path: () => '/api/customers', query: { q: 'a', page: '1', pageSize: '10' }, free: ['q'] },
  'customers/index.post.ts': { path: () => '/api/customers', body: () => ({ name: 'N', email: 'a@test.example', phone: '1' }), free: ['name', 'phone'] },
  'invitations/[token].get.ts': { path: () => '/api/invitations/abcdefghijklmnop' },
  'invitations/[token]/accept.post.ts': { path: () => '/api/invitations/abcdefghijklmnop/accept' },
  'invoices/[id].get.ts': { path: s => `/api/invoices/${s.draft}` },
  'invoices/[id].patch.ts': { path: s => `/api/invoices/${s.draft}`, body: () => ({ state: 'void' }) },
  'invoices/[id]/counter-payment.post.ts': { path: s => `/api/invoices/${s.sent}/counter-payment`, body: () => ({ method: 'cash', amountCents: 100 }) },
  'invoices/[id]/pay-link.delete.ts': { path: s => `/api/invoices/${s.draft}/pay-link` },
  'invoices/[id]/pay-link.get.ts': { path: s => `/api/invoices/${s.sent}/pay-link` },
  'invoices/[id]/pay-link.post.ts': { path: s => `/api/invoices/${s.draft}/pay-link` },
  'invoices/[id]/pay.post.ts': { path: s => `/api/invoices/${s.draft}/pay` },
  'jobs/[id].delete.ts': { path: s => `/api/jobs/${s.job}` },
  'jobs/[id].get.ts': { path: s => `/api/jobs/${s.job}` },
  'jobs/[id].patch.ts': { path: s => `/api/jobs/${s.job}`, body: () => ({ complaint: 'c', priority: 'rush', status: 'on-bench', promisedFor: today, photos: [] }), free: ['complaint'] },
  'jobs/[id]/invoices.post.ts': { path: s => `/api/jobs/${s.job}/invoices`, body: () => ({ kind: 'estimate' }) },
  'jobs/index.get.ts': { path: () => '/api/jobs', query: { status: 'checked-in', tech: randomUUID(), customer: randomUUID(), q: 'a', sort: 'status', dir: 'asc', page: '1', pageSize: '5' }, free: ['q'] },
  'jobs/index.post.ts': { path: () => '/api/jobs', body: s => ({ customerId: s.customer, ampId: s.amp, complaint: 'c', priority: 'normal' }), free: ['complaint'], refs: ['customerId', 'ampId'] },
  'pay/[token].get.ts': { path: () => `/api/pay/${'a'.repeat(43)}` },
  'pay/[token]/pay.post.ts': { path: () => `/api/pay/${'a'.repeat(43)}/pay` },
  'payments/webhook.post.ts': { path: () => '/api/payments/webhook', raw: 'webhook' },
  'procedure-gates/index.post.ts': { path: () => '/api/procedure-gates', body: () => ({ runId: randomUUID(), procedureId: 'drain-and-verify-caps', jobId: null, items: gateItems, acknowledgedAt: new Date().toISOString() }), refs: ['jobId'] },
  'procedure-runs/[id].get.ts': { path: s => `/api/procedure-runs/${s.run}` },
  'procedure-runs/[id].patch.ts': { path: s => `/api/procedure-runs/${s.run}`, body: () => ({ stepIndex: 1, status: 'running', readings: {}, endReason: '' }), free: ['endReason'] },
  'procedure-runs/index.get.ts': { path: () => '/api/procedure-runs', query: { job: randomUUID(), page: '1', pageSize: '5' } },
  'procedure-runs/index.post.ts': { path: () => '/api/procedure-runs', body: () => ({ procedureId: 'drain-and-verify-caps', gateId: randomUUID(), jobId: null, capCount: 3, tubeCount: 2 }), refs: ['jobId', 'gateId'] },
  'rigs/[id].get.ts': { path: () => `/api/rigs/${randomUUID()}` },
  'rigs/reminders/run.post.ts': { path: () => '/api/rigs/reminders/run', body: () => ({ today: '2026-01-01', userId: randomUUID() }), headers: { 'x-task-secret': RIG_REMINDER_SECRET }, emptyOk: true },
  'shop/settings.patch.ts': { path: () => '/api/shop/settings', body: () => ({ name: 'Shop', address: 'a', phone: '1', email: '', labourRateCents: 1, taxRateBasisPoints: 1, currency: 'usd', readyEmail: true }), free: ['name', 'address', 'phone'] },
  'shops/[shopId]/invitations/[invitationId].delete.ts': { path: s => `/api/shops/${s.shopId}/invitations/${s.invitation}` },
  'shops/[shopId]/invitations/index.get.ts': { path: s => `/api/shops/${s.shopId}/invitations` },
  'shops/[shopId]/invitations/index.post.ts': { path: s => `/api/shops/${s.shopId}/invitations`, body: () => ({ email: 'x@test.example', role: 'tech' }) },
  'shops/[shopId]/members/[userId].delete.ts': { path: s => `/api/shops/${s.shopId}/members/${s.member}` },
  'shops/[shopId]/members/[userId].patch.ts': { path: s => `/api/shops/${s.shopId}/members/${s.member}`, body: () => ({ role: 'desk' }) },
  'shops/[shopId]/members/index.get.ts': { path: s => `/api/shops/${s.shopId}/members` },
  'shops/index.post.ts': { path: () => '/api/shops', body: () => ({ id: randomUUID(), name: 'Shop' }), free: ['name'] },
  'stock/lots/[id].delete.ts': { path: s => `/api/stock/lots/${s.lot}` },
  'stock/lots/[id].patch.ts': { path: s => `/api/stock/lots/${s.lot}`, body: () => ({ maker: 'm', costCents: 100, receivedOn: today, notes: 'n' }), free: ['maker', 'notes'] },
  'stock/lots/index.post.ts': { path: () => '/api/stock/lots', body: () => ({ tubeType: 'el84', maker: 'm', costCents: 100 }), free: ['maker'] },
  'stock/sets/[id].delete.ts': { path: s => `/api/stock/sets/${s.set}` },
  'stock/sets/[id].get.ts': { path: s => `/api/stock/sets/${s.set}` },
  'stock/sets/[id].patch.ts': { path: s => `/api/stock/sets/${s.set}`, body: () => ({ label: 'S-1', priceCents: 100 }), free: ['label'] },
  'stock/sets/[id]/return.post.ts': { path: s => `/api/stock/sets/${s.set}/return` },
  'stock/sets/[id]/fit.post.ts': { path: s => `/api/stock/sets/${s.set}/fit`, body: s => ({ jobId: s.job, priceCents: 100 }), refs: ['jobId'] },
  'stock/sets/index.post.ts': { path: () => '/api/stock/sets', body: s => ({ tubeType: '6l6gc', label: 'S-2', tubeIds: s.tubes, size: 2, spreadFraction: 0.02 }), free: ['label'], refs: ['tubeIds'] },
  'stock/tubes/[id].delete.ts': { path: s => `/api/stock/tubes/${s.stockTube}` },
  'stock/tubes/[id].patch.ts': { path: s => `/api/stock/tubes/${s.stockTube}`, body: () => ({ label: 'L', plateVolts: 400, gridVolts: -40, amps: 0.04, testedOn: today }), free: ['label'] },
  'stock/tubes/index.post.ts': { path: () => '/api/stock/tubes', body: s => ({ lotId: s.lot, label: 'L', plateVolts: 400, gridVolts: -40, amps: 0.04, testedOn: today }), free: ['label'], refs: ['lotId'] },
  'sync/pull.post.ts': { path: () => '/api/sync/pull', body: s => ({ clientId: randomUUID(), shopId: s.shopId, schemaVersion: SYNC_SCHEMA_VERSION, cookie: null }), refs: ['shopId'], free: ['cookie'] },
  'sync/push.post.ts': { path: () => '/api/sync/push', body: s => ({ clientId: randomUUID(), shopId: s.shopId, schemaVersion: SYNC_SCHEMA_VERSION, mutations: [] }), refs: ['shopId'] },
  'tubes/[id].delete.ts': { path: s => `/api/tubes/${s.shopTube}` },
  'tubes/[id].patch.ts': { path: s => `/api/tubes/${s.shopTube}`, body: () => ({ name: 'T', maxPlateWatts: 10, heater: 'h', source: 'sheet' }), free: ['name', 'heater', 'source'] },
  'tubes/index.post.ts': { path: () => '/api/tubes', body: () => ({ name: 'T', maxPlateWatts: 10, maxPlateVolts: 300, heater: 'h', ratingSystem: 'design-centre', source: 'sheet' }), free: ['name', 'heater', 'source'] },
}

// Another shop's ids (the demo shop): right shape, wrong shop.
const FOREIGN = [DEMO.shopId, DEMO_JOB, DEMO_CUSTOMER, DEMO_LOT, '6f1c2a10-0000-4000-8002-000000000001']

const sqlText = fc.constantFrom(
  '\' OR 1=1 --', '"; DROP TABLE jobs; --', '1; SELECT * FROM users', '\' UNION SELECT password_hash FROM users --',
  '%', '_', '\\', '\\\'', '%27%20OR%201%3D1', '${7*7}', '{{7*7}}', '../../etc/passwd', '..%2F..%2F', 'null', 'undefined', 'NaN', '-1', '0', '1e309', '0x10',
)
// Longer than any text field allows however it is counted (UTF-16 units or code points).
const hugeText = fc.tuple(fc.constantFrom('x', 'é', '𝄞', '\u202e', '\u0000', ' a'), fc.integer({ min: 4001, max: 20_000 })).map(([c, n]) => c.repeat(n))
/** A string that is no id, e-mail, enum member, date or token. */
const badString = fc.oneof(
  sqlText,
  fc.string({ unit: 'binary', minLength: 1, maxLength: 40 }),
  fc.string({ unit: 'grapheme', minLength: 1, maxLength: 40 }),
  hugeText,
  fc.uuid().map(u => `${u}x`),
  fc.constantFrom('\u0000', '\uFFFF', '\uD800', '🎸🔥', 'ñ'.normalize('NFD'), ' ', '\t\n', 'zzz@', '2026-13-45', 'true'),
)
const deep = fc.tuple(fc.integer({ min: 50, max: 1000 }), fc.boolean()).map(([n, arr]) => {
  let v: unknown = 1
  for (let i = 0; i < n; i++) v = arr ? [v] : { a: v }
  return v
})
const notAString = fc.oneof(fc.integer(), fc.double(), fc.boolean(), fc.array(fc.integer(), { maxLength: 3 }), fc.dictionary(fc.string({ maxLength: 5 }), fc.integer(), { maxKeys: 3 }), deep)
const notANumber = fc.oneof(fc.string({ maxLength: 10 }), fc.boolean(), fc.array(fc.integer(), { maxLength: 3 }), fc.dictionary(fc.string({ maxLength: 5 }), fc.integer(), { maxKeys: 3 }), deep, fc.constantFrom('1', '0x10', 'Infinity'))
const notABoolean = fc.oneof(fc.string({ maxLength: 10 }), fc.integer(), fc.array(fc.boolean(), { maxLength: 3 }), fc.constant({}), deep)
const notAnArray = fc.oneof(fc.string({ maxLength: 10 }), fc.integer(), fc.boolean(), fc.dictionary(fc.string({ maxLength: 5 }), fc.integer(), { maxKeys: 3 }), fc.array(fc.oneof(fc.integer(), badString, fc.constant({})), { minLength: 1, maxLength: 5 }), deep)
const notAnObject = fc.oneof(fc.string({ maxLength: 10 }), fc.integer(), fc.boolean(), fc.array(fc.integer(), { minLength: 1, maxLength: 3 }), fc.dictionary(badString, deep, { minKeys: 1, maxKeys: 2 }))

/** A value of the wrong kind for a field whose valid value is `v`. */
function wrongFor(v: unknown, free: boolean): fc.Arbitrary<unknown> {
  if (typeof v === 'string') return free ? fc.oneof(notAString, hugeText) : fc.oneof(notAString, badString)
  if (typeof v === 'number') return notANumber
  if (typeof v === 'boolean') return notABoolean
  if (Array.isArray(v)) return notAnArray
  if (v === null) return fc.oneof(fc.integer(), fc.boolean(), fc.constant({}), fc.array(fc.integer(), { maxLength: 2 }), free ? hugeText : badString)
  return notAnObject
}

interface Bad { what: string, path: string, method: string, body?: string | Buffer, headers: Record<string, string> }

const rawJunk = fc.oneof(
  fc.constantFrom('{', '{"a":', '[', 'nul', 'undefined', '\u0000', '{"__proto__": {"admin": true}}', '{"constructor": {"prototype": {"x": 1}}}', '[1,2,', '"\\uD800"', '{"a":1}{"b":2}', ''),
  fc.string({ unit: 'binary', maxLength: 200 }),
  fc.integer({ min: 1000, max: 5000 }).map(n => '['.repeat(n)),
  fc.integer({ min: 1000, max: 5000 }).map(n => '{"a":'.repeat(n)),
)

const parsesToObject = (s: string) => {
  try {
    const v = JSON.parse(s)
    return typeof v === 'object' && v !== null && !Array.isArray(v)
  }
  catch {
    return false
  }
}
/** Percent-encoding that survives lone surrogates (sent as the bytes a careless client would send). */
const encode = (s: string) => {
  try {
    return encodeURIComponent(s)
  }
  catch {
    return `${encodeURIComponent(s.replace(/[\uD800-\uDFFF]/g, ''))}%ED%A0%80`
  }
}

function badRequests(file: string, t: Target, s: Fx): fc.Arbitrary<Bad> {
  const method = /\.(get|post|put|patch|delete)\.ts$/.exec(file)![1]!.toUpperCase()
  const validPath = t.path(s)
  const headers = { 'content-type': 'application/json', ...t.headers }
  const validBody = t.body?.(s)
  const json = (b: unknown) => JSON.stringify(b)
  const req = (what: string, path: string, body?: string | Buffer, h: Record<string, string> = headers): Bad => ({ what, path, method, headers: h, body: method === 'GET' ? undefined : body ?? (validBody ? json(validBody) : raw()) })
  const raw = () => (t.raw === 'webhook' ? '{}' : undefined)
  const arbs: fc.Arbitrary<Bad>[] = []

  // Each [param] of the file name, spoiled (the rest of the path stays valid).
  const segments = validPath.split('/')
  const paramAt = file.replace(/\.(get|post|put|patch|delete)\.ts$/, '').replace(/\/index$/, '').split('/').map((p, i) => (p.startsWith('[') ? i + 2 : -1)).filter(i => i >= 0)
  for (const i of paramAt) {
    arbs.push(fc.oneof(badString, fc.constantFrom(...FOREIGN)).map(v => req(`param ${i}`, [...segments.slice(0, i), encode(v).slice(0, 6000), ...segments.slice(i + 1)].join('/'))))
  }
  if (t.query) {
    const keys = Object.keys(t.query)
    const freeValues = fc.oneof(hugeText.map(v => [v]), fc.array(fc.string({ maxLength: 5 }), { minLength: 2, maxLength: 3 }))
    // Hex numbers read as numbers, and an empty filter is no filter: neither is bad input for a query.
    const badValues = fc.oneof(badString.filter(v => v !== '0x10' && v.trim() !== '').map(v => [v]), freeValues, fc.constantFrom(['-1'], ['0'], ['1e9'], ['1.5'], ['NaN']))
    arbs.push(fc.constantFrom(...keys).chain(k => fc.tuple(fc.constant(k), t.free?.includes(k) ? freeValues : badValues))
      .map(([k, vs]) => {
        const q = new URLSearchParams(t.query)
        q.delete(k)
        for (const v of vs) q.append(k, v.slice(0, 6000))
        return req(`query ${k}`, `${validPath}?${q}`)
      }))
  }
  if (validBody) {
    const body = validBody
    const keys = Object.keys(body)
    arbs.push(fc.oneof(...keys.map(k => wrongFor(body[k], !!t.free?.includes(k)).map(v => [k, v] as const)))
      .map(([k, v]) => req(`field ${k}`, validPath, json({ ...body, [k]: v }))))
    if (t.refs?.length) {
      arbs.push(fc.tuple(fc.constantFrom(...t.refs), fc.constantFrom(...FOREIGN))
        .map(([k, v]) => req(`foreign ${k}`, validPath, json({ ...body, [k]: Array.isArray(body[k]) ? (body[k] as unknown[]).map((_, i) => (i ? randomUUID() : v)) : v }))))
    }
    arbs.push(fc.oneof(fc.integer(), fc.string({ maxLength: 20 }), fc.boolean(), fc.constant(null), fc.array(fc.integer(), { maxLength: 4 }), deep)
      .filter(v => !t.emptyOk || !parsesToObject(json(v))).map(v => req('not an object', validPath, json(v))))
    const junk = rawJunk.filter(v => !t.emptyOk || !parsesToObject(v))
    arbs.push(junk.map(v => req('not JSON', validPath, v)))
    arbs.push(fc.tuple(fc.constantFrom('text/plain', 'multipart/form-data; boundary=x', 'application/xml'), junk).map(([ct, v]) => req('content type', validPath, v, { ...headers, 'content-type': ct })))
    // A good body under a form's content type, as a page on another site could post it.
    if (validBody) arbs.push(fc.constantFrom('text/plain', 'text/plain;charset=UTF-8', 'application/x-www-form-urlencoded', 'multipart/form-data; boundary=x').map(ct => req('form content type', validPath, json(validBody), { ...headers, 'content-type': ct })))
  }
  if (t.raw === 'photo') {
    arbs.push(fc.uint8Array({ minLength: 1, maxLength: 2000 }).map((bytes) => {
      const b = Buffer.from(bytes)
      return req('not a photo', `/api/blobs/${photo().sha256}`, b, { 'content-type': 'image/png' })
    }))
    arbs.push(fc.constantFrom('text/html', 'image/svg+xml', '', 'image/png; charset=utf-8', 'IMAGE/PNG', 'image/png, image/jpeg').map(ct => req('photo type', validPath, photo().bytes, { 'content-type': ct })))
  }
  if (t.raw === 'webhook') {
    arbs.push(fc.tuple(fc.oneof(rawJunk, fc.json()), fc.oneof(fc.constant(undefined), badString.map(s => s.slice(0, 500)), fc.constant('sign-with-another-secret'))).map(([payload, sig]) => {
      const h: Record<string, string> = { 'content-type': 'application/json' }
      if (sig === 'sign-with-another-secret') h['stripe-signature'] = signWebhook(payload, 'whsec_not_ours')
      else if (sig !== undefined) h['stripe-signature'] = sig.replace(/[^\t\x20-\x7e]/g, '?')
      return req('webhook', validPath, payload, h)
    }))
  }
  if (!arbs.length) throw new Error(`${file}: nothing to spoil`)
  return fc.oneof(...arbs)
}

// What a reply must never carry: a stack frame, a file path, SQL or driver errors.
const LEAKS = [/\bat [\w.<>]+ \(/, /\bat (file:|\/)/, /\/(work|home|usr|tmp)\//, /node_modules|\.output|\.m?[jt]s:\d+/, /\bSQL\b/, /ER_[A-Z_]+/, /\bselect .* from\b/i, /\binsert into\b/i, /mysql|mariadb|drizzle/i, /sqlMessage|sqlState|errno/]

/** The reply's text with the request's own strings taken out (a message may quote what was sent). */
function scrub(text: string, bad: Bad) {
  // The error reply names the URL asked for: that is the request's own text.
  let out = text.replace(/"url":\s*"[^"]*"/, '')
  let path = bad.path
  try {
    path = decodeURIComponent(bad.path.replace(/\+/g, ' '))
  }
  catch { /* left encoded */ }
  const sent = [path, bad.path, typeof bad.body === 'string' ? bad.body : '']
  for (const s of sent) {
    for (const piece of s.split(/[/?&=",:{}[\]]/).filter(p => p.length > 3)) out = out.split(piece.slice(0, 30)).join('')
  }
  return out
}

async function send(c: Client, bad: Bad) {
  const headers: Record<string, string> = { ...bad.headers, cookie: c.cookie }
  if (bad.body !== undefined) headers['content-length'] = String(Buffer.byteLength(bad.body))
  const res = await fetch(BASE + bad.path, { method: bad.method, headers, body: bad.body })
  return { status: res.status, text: await res.text() }
}

async function pool<T>(items: T[], n: number, fn: (t: T) => Promise<void>) {
  let next = 0
  await Promise.all(Array.from({ length: n }, async () => {
    while (next < items.length) await fn(items[next++]!)
  }))
}

type Fx = Record<string, string> & { tubes: string[] } & { shopId: string }
let owner: Client
let fx: Fx
let userId: string
let shopTables: string[]

/** Row counts of every table that has a shop id, for the throwaway shop, plus its version and its owner's audit rows. */
async function counts() {
  const parts = shopTables.map(t => `select '${t}' t, count(*) n from \`${t}\` where shop_id = ?`)
  const rows = await sql<{ t: string, n: number }>(parts.join(' union all '), shopTables.map(() => fx.shopId))
  const [v] = await sql('select version from shop_versions where shop_id = ?', [fx.shopId])
  const [a] = await sql('select count(*) n from audit_log where user_id = ?', [userId])
  return { ...Object.fromEntries(rows.map(r => [r.t, Number(r.n)])), version: Number(v?.version ?? 0), audit: Number(a.n) }
}

beforeAll(async () => {
  const o = await newOwner('malformed')
  owner = o.c
  userId = o.userId
  const f = shopFixtures(owner, o.shopId)
  const customer = await f.customer()
  const [amp, job, draft, sent, lot, set, shopTube, invitation, member, run, shot] = await Promise.all([
    f.amp(customer), f.job(customer), f.invoice({ customerId: customer }), f.invoice({ customerId: customer, sent: true }), f.lot(), f.matchedSet(), f.shopTube(), f.invitation(), f.member(), f.run(), putPhoto(owner),
  ])
  const tubes = [await f.stockTube(lot), await f.stockTube(lot)]
  fx = { shopId: o.shopId, customer, amp, job, draft: draft.id, sent: sent.id, lot, set: set.setId, shopTube, invitation: invitation.id, member, run, photo: shot.sha256, stockTube: tubes[0]!, tubes } as Fx
  const cols = await sql<{ t: string }>('select table_name t from information_schema.columns where table_schema = database() and column_name = \'shop_id\'')
  shopTables = cols.map(r => r.t).filter(t => t !== 'shop_versions').sort()
}, 120_000)

describe('malformed input', () => {
  const files = readdirSync('server/api', { recursive: true, encoding: 'utf8' }).map(f => f.split('\\').join('/')).filter(f => f.endsWith('.ts')).sort()

  it('covers every route that reads a body, query or parameters', () => {
    const takesInput = files.filter(f => !NO_INPUT.includes(f))
    expect(takesInput.filter(f => !(f in TARGETS)), 'route files with no entry in TARGETS').toEqual([])
    expect(Object.keys(TARGETS).filter(f => !files.includes(f)), 'entries whose file is gone').toEqual([])
    // A route listed as taking nothing must really read nothing.
    const readers = NO_INPUT.filter(f => /valid(Body|Query|Params)|readBody|readRawBody|getQuery|getRouterParam/.test(readFileSync(`server/api/${f}`, 'utf8')))
    expect(readers).toEqual([])
  })

  for (const [file, target] of Object.entries(TARGETS).filter(([f]) => f.includes(ONLY))) {
    it(`${file}: ${RUNS} bad requests, each refused with a 4xx, no leak, nothing written`, async () => {
      const samples = fc.sample(badRequests(file, target, fx), { numRuns: RUNS, seed: SEED + file.length })
      const before = await counts()
      const failures: string[] = []
      await pool(samples, POOL, async (bad) => {
        const r = await send(owner, bad)
        const leak = LEAKS.find(re => re.test(scrub(r.text, bad)))
        // A bad request is refused (4xx): a 2xx means it was taken for a good one.
        if (r.status >= 500 || r.status < 400 || leak) {
          failures.push(`${bad.method} ${bad.path.slice(0, 150)} [${bad.what}] body ${String(bad.body ?? '').slice(0, 150)} -> ${r.status}${leak ? ` leaks ${leak}` : ''}: ${r.text.slice(0, 300)}`)
        }
      })
      expect(failures.slice(0, 5), `seed ${SEED}`).toEqual([])
      expect(await counts()).toEqual(before)
    }, 180_000)
  }
})
