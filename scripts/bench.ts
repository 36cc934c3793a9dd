// npm run bench: sync throughput on this machine, beside plain batched inserts as a reference.
// Figures are printed, never asserted.
import { randomUUID } from 'node:crypto'
import { performance } from 'node:perf_hooks'
import { createConnection } from 'mysql2/promise'
import { startThrowawayStack } from './lib/stack.mjs'

const stack = await startThrowawayStack({ log: () => {} })
Object.assign(process.env, stack.testEnv)
const { newOwner } = await import('../tests/api/helpers/client')
const { SYNC_SCHEMA_VERSION } = await import('../shared/utils/sync/protocol')

const rate = (n: number, ms: number) => `${Math.round(n / (ms / 1000)).toLocaleString('en')} /s`
try {
  const { c, shopId, userId } = await newOwner('bench')
  const clientId = randomUUID()
  const PUSH = 5000
  const BATCH = 500
  let t = performance.now()
  for (let start = 1; start <= PUSH; start += BATCH) {
    const mutations = Array.from({ length: BATCH }, (_, k) => ({
      id: start + k, uuid: randomUUID(), name: 'note.create', args: { id: randomUUID(), jobId: null, body: `bench note ${start + k}` },
    }))
    const r = await c.post('/api/sync/push', { clientId, shopId, schemaVersion: SYNC_SCHEMA_VERSION, mutations })
    if (r.status !== 200) throw new Error(`push ${r.status}`)
  }
  const pushMs = performance.now() - t

  // Top up to 10,000 rows for the pull.
  for (let start = PUSH + 1; start <= 10_000; start += BATCH) {
    const mutations = Array.from({ length: BATCH }, (_, k) => ({
      id: start + k, uuid: randomUUID(), name: 'note.create', args: { id: randomUUID(), jobId: null, body: `bench note ${start + k}` },
    }))
    await c.post('/api/sync/push', { clientId, shopId, schemaVersion: SYNC_SCHEMA_VERSION, mutations })
  }
  t = performance.now()
  let cookie: string | null = null
  let rows = 0
  const puller = randomUUID()
  for (;;) {
    const r = await c.post('/api/sync/pull', { clientId: puller, shopId, schemaVersion: SYNC_SCHEMA_VERSION, cookie })
    rows += r.body.changes.length
    cookie = r.body.cookie
    if (!r.body.more) break
  }
  const pullMs = performance.now() - t

  const conn = await createConnection({ uri: stack.dbUrl, timezone: 'Z' })
  const INSERTS = 10_000
  t = performance.now()
  for (let start = 0; start < INSERTS; start += BATCH) {
    const values = Array.from({ length: BATCH }, (_, k) => [randomUUID(), shopId, userId, `plain ${start + k}`, '{}', 1])
    await conn.query('insert into notes (id, shop_id, created_by, body, field_stamps, version) values ?', [values])
  }
  const insertMs = performance.now() - t
  await conn.end()

  const insertRate = INSERTS / insertMs
  console.log('\nTubewright sync benchmark (this machine, loopback, one client)')
  console.log(`  push   ${PUSH.toLocaleString('en')} mutations in batches of ${BATCH}: ${(pushMs / 1000).toFixed(2)} s, ${rate(PUSH, pushMs)}`)
  console.log(`  pull   ${rows.toLocaleString('en')} rows, pages of 500:           ${(pullMs / 1000).toFixed(2)} s, ${rate(rows, pullMs)}`)
  console.log(`  plain  ${INSERTS.toLocaleString('en')} batched INSERTs (reference):     ${(insertMs / 1000).toFixed(2)} s, ${rate(INSERTS, insertMs)}`)
  console.log(`  overhead: push is ${(insertRate / (PUSH / pushMs)).toFixed(1)}x slower than plain inserts; pull reads ${((rows / pullMs) / insertRate).toFixed(2)}x the insert rate`)
}
finally {
  await stack.stop()
}
