// Taking the database, the mail server and the payment provider away from a running app, and
// giving them back. This file runs its own stack (MariaDB, fakes, app) so stopping them never
// touches the shared test database the other files use.
// Before Dexie is loaded (the engine's module), so it finds an IndexedDB.
import 'fake-indexeddb/auto'
import { randomUUID } from 'node:crypto'
import { existsSync, readdirSync, readFileSync } from 'node:fs'
import { join } from 'node:path'
import { createConnection } from 'mysql2/promise'
import { afterAll, beforeAll, describe, expect, it } from 'vitest'
import { startThrowawayStack } from '../../scripts/lib/stack.mjs'
import { SYNC_SCHEMA_VERSION } from '../../shared/utils/sync/protocol'
import { SyncHttpError } from '../../app/utils/sync/engine'
import { client, DEMO, DEMO_PASSWORD, type Client } from './helpers/client'
import { device, type Device } from './helpers/devices'

type Stack = Awaited<ReturnType<typeof startThrowawayStack>>
let stack: Stack

beforeAll(async () => {
  stack = await startThrowawayStack({ log: () => {}, serverStdio: process.env.TW_DEBUG_SERVER ? 'inherit' : 'ignore' })
}, 240_000)
afterAll(async () => {
  await stack?.stop()
}, 60_000)

const DEMO_JOB = '6f1c2a10-0000-4000-8003-000000000001'
const DEMO_INVOICE = '6f1c2a10-0000-4000-8006-000000000001'

async function signIn(email: string): Promise<Client> {
  const c = client(stack.url)
  const r = await c.post('/api/auth/login', { email, password: DEMO_PASSWORD })
  if (r.status !== 200) throw new Error(`login ${email}: ${r.status}`)
  return c
}

async function sql<T = any>(query: string, params: unknown[] = []): Promise<T[]> {
  const c = await createConnection({ uri: stack.dbUrl, timezone: 'Z' })
  try {
    return (await c.query(query, params))[0] as T[]
  }
  finally {
    await c.end()
  }
}

const sleep = (ms: number) => new Promise(r => setTimeout(r, ms))
async function until<T>(what: string, fn: () => Promise<T | undefined | false>, timeoutMs = 30_000): Promise<T> {
  const deadline = Date.now() + timeoutMs
  for (;;) {
    const v = await fn().catch(() => undefined)
    if (v) return v
    if (Date.now() > deadline) throw new Error(`timed out waiting for ${what}`)
    await sleep(200)
  }
}

/** A device saving a note and pushing, over and over, until told to stop; it records how pushes were answered. */
function busyDevice(d: Device) {
  const ids: string[] = []
  const answers: (number | 'ok' | 'network')[] = []
  let running = true
  const done = (async () => {
    for (let i = 0; running; i++) {
      const id = randomUUID()
      await d.engine.mutate('note.create', { id, jobId: DEMO_JOB, body: `bench note ${i}` })
      ids.push(id)
      try {
        await d.engine.push()
        answers.push('ok')
      }
      catch (e) {
        answers.push(e instanceof SyncHttpError ? e.status : 'network')
      }
      await sleep(40)
    }
  })()
  return { ids, answers, stop: async () => { running = false; await done } }
}

function mailTo(address: string) {
  if (!existsSync(stack.mailDir)) return []
  return readdirSync(stack.mailDir).map(f => JSON.parse(readFileSync(join(stack.mailDir, f), 'utf8')) as { to: string[], raw: string })
    .filter(m => m.to.includes(address))
}

const alive = (pid: number) => {
  try {
    process.kill(pid, 0)
    return true
  }
  catch {
    return false
  }
}

describe('the database goes away while the app serves and devices push', () => {
  it('answers 503 with a sentence, devices keep their outbox, nothing is lost or doubled, and the same process recovers', async () => {
    const [owner, tech, desk] = await Promise.all([DEMO.owner, DEMO.tech, DEMO.desk].map(signIn))
    const devices = await Promise.all([tech, desk].map(async (c) => {
      const userId = (await c.get('/api/auth/me')).body.user.id as string
      return device(c, DEMO.shopId, { userId })
    }))
    const busy = devices.map(busyDevice)
    await until('the first pushes', async () => busy.every(b => b.answers.includes('ok')))

    await stack.mariadb.stop()
    // Answers from a process whose database is gone: a 503 with a sentence, never a 500 or a stack.
    for (const [method, path, body] of [['GET', '/api/jobs'], ['GET', `/api/jobs/${DEMO_JOB}`], ['PATCH', `/api/jobs/${DEMO_JOB}`, { complaint: 'Hums' }], ['GET', '/api/health'], ['GET', '/api/mail']] as const) {
      const r = await owner.raw(method, path, body)
      expect(r.status, `${method} ${path}`).toBe(503)
      expect(r.headers.get('content-type')).toMatch(/application\/json/)
      expect(r.body.message, `${method} ${path}`).toMatch(/database/i)
      expect(JSON.stringify(r.body)).not.toMatch(/at .*\.m?js:\d+|ECONNREFUSED|PROTOCOL_/)
    }
    const pendingWhileDown = await until('pushes refused while the database is down', async () => {
      const counts = await Promise.all(devices.map(d => d.engine.pendingCount()))
      return busy.every(b => b.answers.slice(-2).every(a => a === 503)) && counts.every(n => n > 0) && counts
    })
    expect(pendingWhileDown.every(n => n > 0)).toBe(true)

    await stack.mariadb.start()
    // The same app process, its pool reconnecting on its own.
    await until('the app to answer again', async () => (await owner.get('/api/jobs')).status === 200)
    expect(alive(stack.serverPid!)).toBe(true)
    await until('a push to be taken again', async () => busy.every(b => b.answers.at(-1) === 'ok'))
    await Promise.all(busy.map(b => b.stop()))

    for (const [i, d] of devices.entries()) {
      // Every change the device ever made, sent again as one batch: each was applied once already.
      const { clientId } = await d.engine.meta()
      await d.engine.push()
      const sent = await d.db.outbox.where('shopId').equals(DEMO.shopId).sortBy('id')
      expect(sent.length).toBe(busy[i]!.ids.length)
      const replay = await d.http.post('/api/sync/push', {
        clientId, shopId: DEMO.shopId, schemaVersion: SYNC_SCHEMA_VERSION,
        mutations: sent.map(m => ({ id: m.id, uuid: m.uuid, name: m.name, args: m.args })),
      })
      expect(replay.status).toBe(200)
      expect(new Set(replay.body.results.map((r: { status: string }) => r.status))).toEqual(new Set(['duplicate']))
      await d.engine.sync()
      expect(await d.engine.pendingCount()).toBe(0)

      const rows = await sql<{ id: string }>('select id from notes where id in (?)', [busy[i]!.ids])
      expect(rows.map(r => r.id).sort()).toEqual([...busy[i]!.ids].sort())
      const [log] = await sql<{ n: number, u: number }>('select count(*) n, count(distinct uuid) u from sync_mutations where client_id = ?', [clientId])
      expect(Number(log!.n)).toBe(busy[i]!.ids.length)
      expect(Number(log!.u)).toBe(busy[i]!.ids.length)
      // The device's own view shows each note once.
      const seen = await d.db.table('notes').where('id').anyOf(busy[i]!.ids).count()
      expect(seen).toBe(busy[i]!.ids.length)
    }
    // Some changes were made while the database was away; none of them was lost, and no push got a bare 500.
    expect(busy.some(b => b.answers.includes(503))).toBe(true)
    expect(busy.flatMap(b => b.answers).filter(a => a !== 'ok' && a !== 503)).toEqual([])
  }, 180_000)
})

describe('the mail server goes away', () => {
  it('keeps the message, retries it once the server is back, and sends it exactly once', async () => {
    const owner = await signIn(DEMO.owner)
    const invite = (email: string) => owner.post(`/api/shops/${DEMO.shopId}/invitations`, { email, role: 'tech' })
    const first = `later-${randomUUID().slice(0, 8)}@test.example`

    await stack.smtp.stop()
    const r = await invite(first)
    expect(r.status).toBe(201)
    expect(r.body.mailed).toBe(false)
    const [queued] = await sql<{ delivered: number, attempts: number, next_attempt_at: Date | null }>('select delivered, attempts, next_attempt_at from sent_mail where to_address = ?', [first])
    expect(queued).toMatchObject({ delivered: 0, attempts: 1 })
    expect(queued!.next_attempt_at).not.toBeNull()
    expect(mailTo(first)).toHaveLength(0)
    expect((await owner.get('/api/mail')).body.items.filter((m: { to: string }) => m.to === first)).toEqual([expect.objectContaining({ delivered: false, retrying: true })])

    await stack.smtp.start()
    // The next message that goes through sends what waited, without waiting for its slot.
    const second = `now-${randomUUID().slice(0, 8)}@test.example`
    expect((await invite(second)).body.mailed).toBe(true)
    await until('the queued invitation', async () => mailTo(first).length > 0)
    expect(mailTo(first)[0]!.raw).toContain('/invite/')
    const [sent] = await sql<{ delivered: number, attempts: number, next_attempt_at: Date | null }>('select delivered, attempts, next_attempt_at from sent_mail where to_address = ?', [first])
    expect(sent).toMatchObject({ delivered: 1, attempts: 2, next_attempt_at: null })

    // More mail afterwards sends nothing twice.
    expect((await invite(`after-${randomUUID().slice(0, 8)}@test.example`)).body.mailed).toBe(true)
    await sleep(500)
    expect(mailTo(first)).toHaveLength(1)
    expect(mailTo(second)).toHaveLength(1)
    const outbox = (await owner.get('/api/mail')).body.items.filter((m: { to: string }) => m.to === first)
    expect(outbox).toEqual([expect.objectContaining({ delivered: true, retrying: false })])
  }, 60_000)
})

describe('the payment provider goes away', () => {
  it('answers a clear 503 with nothing charged; the retry and repeated webhooks mark the invoice paid once', async () => {
    const dana = await signIn(DEMO.dana)
    const payments = () => sql<{ status: string }>('select status from payments where invoice_id = ?', [DEMO_INVOICE])

    await stack.payments.stop()
    const refused = await dana.post(`/api/invoices/${DEMO_INVOICE}/pay`)
    expect(refused.status).toBe(503)
    expect(refused.body.message).toMatch(/payment service is not answering; nothing was charged/i)
    expect(await payments()).toEqual([])
    expect((await dana.get(`/api/invoices/${DEMO_INVOICE}`)).body.state).toBe('sent')

    await stack.payments.start()
    const paid = await dana.post(`/api/invoices/${DEMO_INVOICE}/pay`)
    expect(paid.status).toBe(202)
    await until('the webhook to mark it paid', async () => (await dana.get(`/api/invoices/${DEMO_INVOICE}`)).body.state === 'paid')

    // The provider repeats its event (as it does when an answer is slow), several times at once.
    const [delivery] = stack.payments.deliveries()
    expect(delivery).toBeDefined()
    const replays = await Promise.all(Array.from({ length: 4 }, () => fetch(`${stack.url}/api/payments/webhook`, {
      method: 'POST', headers: { 'content-type': 'application/json', 'stripe-signature': delivery!.signature }, body: delivery!.payload,
    }).then(async r => ({ status: r.status, body: await r.json() }))))
    for (const r of replays) expect(r).toEqual({ status: 200, body: { received: true, duplicate: true } })
    expect((await dana.post(`/api/invoices/${DEMO_INVOICE}/pay`)).status).toBe(409)

    expect(await payments()).toEqual([{ status: 'succeeded' }])
    const [audit] = await sql<{ n: number }>('select count(*) n from audit_log where action = \'invoice.paid\' and json_value(detail, \'$.invoiceId\') = ?', [DEMO_INVOICE])
    expect(Number(audit!.n)).toBe(1)
  }, 60_000)
})
