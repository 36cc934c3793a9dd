// Sync push and pull of a phone's backlog (one client, loopback) beside plain batched INSERTs.
import { randomUUID } from 'node:crypto'
import { performance } from 'node:perf_hooks'
import { createConnection } from 'mysql2/promise'

interface Pull { changes: unknown[], cookie: string | null, more: boolean }
type Poster = { post: (path: string, body: unknown) => Promise<{ status: number, body: unknown }> }

export async function syncFigures(c: Poster, shopId: string, userId: string, dbUrl: string, schemaVersion: number) {
  const clientId = randomUUID()
  const PUSH = 5000
  const BATCH = 500
  const batch = (start: number) => Array.from({ length: BATCH }, (_, k) => ({
    id: start + k, uuid: randomUUID(), name: 'note.create', args: { id: randomUUID(), jobId: null, body: `bench note ${start + k}` },
  }))
  let t = performance.now()
  for (let start = 1; start <= PUSH; start += BATCH) {
    const r = await c.post('/api/sync/push', { clientId, shopId, schemaVersion, mutations: batch(start) })
    if (r.status !== 200) throw new Error(`push ${r.status}`)
  }
  const pushMs = performance.now() - t
  // Top up to 10,000 rows for the pull.
  for (let start = PUSH + 1; start <= 10_000; start += BATCH) {
    await c.post('/api/sync/push', { clientId, shopId, schemaVersion, mutations: batch(start) })
  }
  t = performance.now()
  let cookie: string | null = null
  let rows = 0
  const puller = randomUUID()
  for (;;) {
    const page = (await c.post('/api/sync/pull', { clientId: puller, shopId, schemaVersion, cookie })).body as Pull
    rows += page.changes.length
    cookie = page.cookie
    if (!page.more) break
  }
  const pullMs = performance.now() - t

  const conn = await createConnection({ uri: dbUrl, timezone: 'Z' })
  const INSERTS = 10_000
  t = performance.now()
  for (let start = 0; start < INSERTS; start += BATCH) {
    const values = Array.from({ length: BATCH }, (_, k) => [randomUUID(), shopId, userId, `plain ${start + k}`, '{}', 1])
    await conn.query('insert into notes (id, shop_id, created_by, body, field_stamps, version) values ?', [values])
  }
  const insertMs = performance.now() - t
  await conn.end()
  return { push: PUSH / (pushMs / 1000), pull: rows / (pullMs / 1000), rows, insert: INSERTS / (insertMs / 1000), BATCH }
}
