// npm run bench: every performance figure of the app on this machine, each beside a reference
// measured in the same run and a budget, marked PASS or FAIL. Never part of npm test.
import { randomUUID } from 'node:crypto'
import { createConnection } from 'mysql2/promise'
import { startThrowawayStack } from './lib/stack.mjs'
import { startBare } from './bench/bare'
import { firstLoad, launch, offlineShell } from './bench/browser'
import { lighthouse } from './bench/lighthouse'
import { load } from './bench/load'
import { sortFigures } from './bench/sort'
import { syncFigures } from './bench/sync'
import { kb, median, ms, perSecond, record, summary } from './bench/report'

const LIGHTHOUSE_RUNS = Number(process.env.TW_BENCH_LIGHTHOUSE_RUNS || 3)
const only = (process.env.TW_BENCH_ONLY || 'size,offline,lighthouse,api,sync,sort').split(',')

console.log('Tubewright benchmark: starting a throwaway stack and building the bare reference page...')
const stack = await startThrowawayStack({ log: () => {} })
Object.assign(process.env, stack.testEnv)
const { login, newOwner } = await import('../tests/api/helpers/client')
const { SYNC_SCHEMA_VERSION } = await import('../shared/utils/sync/protocol')
const bare = only.includes('size') || only.includes('lighthouse') ? await startBare() : null
const app = stack.url
let failed: number | undefined
try {
  const owner = await login('owner@larkspur.example')
  const cookie = owner.cookie

  if (only.includes('size') && bare) {
    console.log('\nFirst load, JS + CSS the first screen waits for (gzip), phone viewport, cold cache (median of 3)')
    const browser = await launch()
    try {
      const ref = await firstLoad(browser, bare.url, '/')
      record({ group: 'size', what: 'bare Nuxt page with the PWA module (reference)', value: `${kb(ref.firstScreen)} in ${ref.files} files`, budget: 'none', pass: null })
      for (const [path, signedIn] of [['/signin', false], ['/', true], ['/jobs', true]] as const) {
        // A file counts when it finished before the heading showed, which races with the chunks
        // that load after the first screen: the median of three loads.
        const loads = []
        for (let i = 0; i < 3; i++) loads.push(await firstLoad(browser, app, path, signedIn ? cookie : undefined))
        const f = loads.sort((a, b) => a.firstScreen - b.firstScreen)[1]!
        const ratio = f.firstScreen / ref.firstScreen
        record({
          group: 'size',
          what: `${path}${signedIn ? ' (signed in)' : ''}`,
          value: `${kb(f.firstScreen)} in ${f.files} files = ${ratio.toFixed(2)}x; then ${kb(f.after)} in ${f.afterFiles} files after it`,
          reference: kb(ref.firstScreen),
          budget: '<= 1.50x',
          pass: ratio <= 1.5,
        })
      }
    }
    finally {
      await browser.close()
    }
  }

  if (only.includes('offline')) {
    console.log('\nApp shell from the service worker, network cut (5 reloads, median)')
    const browser = await launch()
    try {
      const times = await offlineShell(browser, app, cookie)
      const m = median(times)
      record({ group: 'offline', what: 'Bench on screen after an offline reload', value: `${ms(m)} (runs: ${times.map(t => Math.round(t)).join(', ')})`, budget: '<= 300 ms', pass: m <= 300 })
    }
    finally {
      await browser.close()
    }
  }

  if (only.includes('lighthouse') && bare) {
    console.log(`\nMobile Lighthouse (simulated slow 4G, 4x CPU; median of ${LIGHTHOUSE_RUNS})`)
    const ref = await lighthouse(`${bare.url}/`, undefined, LIGHTHOUSE_RUNS)
    record({ group: 'lighthouse', what: 'bare page (reference)', value: `performance ${ref.performance}, accessibility ${ref.accessibility}, TBT ${ms(ref.tbt)}, LCP ${(ref.lcp / 1000).toFixed(1)} s`, budget: 'none', pass: null })
    for (const [path, signedIn] of [['/signin', false], ['/', true], ['/bench/idle-dissipation', true], ['/jobs', true]] as const) {
      const r = await lighthouse(app + path, signedIn ? cookie : undefined, LIGHTHOUSE_RUNS)
      const what = `${path}${signedIn ? ' (signed in)' : ''}`
      const lcp = `LCP ${(r.lcp / 1000).toFixed(1)} s`
      record({ group: 'lighthouse', what: `${what} performance`, value: `${r.performance} (${lcp})`, reference: String(ref.performance), budget: '>= 90', pass: r.performance >= 90 })
      record({ group: 'lighthouse', what: `${what} accessibility`, value: String(r.accessibility), budget: '>= 95', pass: r.accessibility >= 95 })
      record({ group: 'lighthouse', what: `${what} total blocking time`, value: ms(r.tbt), reference: ms(ref.tbt), budget: '<= 200 ms', pass: r.tbt <= 200 })
    }
  }

  if (only.includes('sync')) {
    console.log('\nSync throughput, one client, batches of 500 (beside plain batched INSERTs)')
    const { c, shopId, userId } = await newOwner('bench')
    const s = await syncFigures(c, shopId, userId, stack.dbUrl, SYNC_SCHEMA_VERSION)
    record({ group: 'sync', what: `plain batched INSERTs of 10,000 notes (reference)`, value: perSecond(s.insert), budget: 'none', pass: null })
    record({ group: 'sync', what: 'push of 5,000 note.create', value: `${perSecond(s.push)} = ${(s.push / s.insert).toFixed(2)}x`, reference: perSecond(s.insert), budget: '>= 0.10x', pass: s.push / s.insert >= 0.1 })
    record({ group: 'sync', what: `pull of ${s.rows.toLocaleString('en')} rows`, value: `${perSecond(s.pull)} = ${(s.pull / s.insert).toFixed(2)}x`, reference: perSecond(s.insert), budget: '>= 0.50x', pass: s.pull / s.insert >= 0.5 })
  }

  if (only.includes('sort')) {
    console.log('\nTube sorter')
    const s = sortFigures()
    const ratio = s.ms / s.referenceMs
    record({ group: 'sort', what: `sortIntoSets, 1,000 readings into sets of 4 (${s.sets} sets)`, value: `${s.ms.toFixed(2)} ms = ${ratio.toFixed(1)}x`, reference: `sorting the readings alone ${s.referenceMs.toFixed(2)} ms`, budget: '<= 5x', pass: ratio <= 5 })
  }
  // Last: the push load leaves the server busy with the requests still queued when it ends.
  if (only.includes('api')) {
    console.log('\nAPI under load (autocannon, 50 connections, 10 s each)')
    const busy = await newOwner('bench-busy')
    await addJobs(stack.dbUrl, busy.shopId, busy.userId, 2000)
    const health = await load({ url: `${app}/api/health` })
    record({ group: 'api', what: 'GET /api/health, one select 1 (reference)', value: `${perSecond(health.rps)}, p95 ${ms(health.p95)}`, budget: 'none', pass: null })
    const jobs = await load({ url: `${app}/api/jobs?status=checked-in,on-bench,waiting-parts,soak,ready&sort=promisedFor&dir=asc`, headers: { cookie: busy.c.cookie } })
    judgeLoad('GET /api/jobs (2,000 jobs, open ones by promised date, first page)', jobs, health.rps)

    // 50 phones in 10 shops, each push 100 new notes the server has never seen.
    const shops = await Promise.all(Array.from({ length: 10 }, (_, i) => newOwner(`bench-push-${i}`)))
    let connection = 0
    const push = await load({
      url: `${app}/api/sync/push`,
      next: (conn) => {
        if (conn.clientId === undefined) {
          const shop = shops[connection++ % shops.length]!
          Object.assign(conn, { clientId: randomUUID(), shopId: shop.shopId, cookie: shop.c.cookie, n: 0 })
        }
        const c = conn as { clientId: string, shopId: string, cookie: string, n: number }
        const mutations = Array.from({ length: 100 }, () => ({ id: ++c.n, uuid: randomUUID(), name: 'note.create', args: { id: randomUUID(), jobId: null, body: `bench note ${c.n}` } }))
        return {
          method: 'POST', path: '/api/sync/push',
          headers: { 'content-type': 'application/json', 'cookie': c.cookie },
          body: JSON.stringify({ clientId: c.clientId, shopId: c.shopId, schemaVersion: SYNC_SCHEMA_VERSION, mutations }),
        }
      },
    })
    judgeLoad('POST /api/sync/push, 100 new notes per request (50 devices, 10 shops)', push, health.rps)
  }

  failed = summary()
}
finally {
  bare?.stop()
  await stack.stop()
}
process.exit(failed ? 1 : 0)

function judgeLoad(what: string, f: Awaited<ReturnType<typeof load>>, healthRps: number) {
  const ratio = f.rps / healthRps
  const clean = f.errors === 0 && f.non2xx === 0
  record({
    group: 'api',
    what,
    value: `${perSecond(f.rps)} = ${ratio.toFixed(2)}x, p95 ${ms(f.p95)}${clean ? '' : `, ${f.errors} errors, ${f.non2xx} non-2xx`}`,
    reference: perSecond(healthRps),
    budget: 'p95 <= 50 ms and >= 0.30x',
    pass: clean && f.p95 <= 50 && ratio >= 0.3,
  })
}

/** A busy shop: `n` jobs over n / 5 customers and amps, in every state, spread over a year. */
async function addJobs(dbUrl: string, shopId: string, userId: string, n: number) {
  const conn = await createConnection({ uri: dbUrl, timezone: 'Z' })
  const states = ['checked-in', 'on-bench', 'waiting-parts', 'soak', 'ready', 'handed-back', 'closed', 'cancelled']
  const customers = Array.from({ length: n / 5 }, (_, i) => [randomUUID(), shopId, 1, '{}', userId, `Customer ${i}`, ''])
  const amps = customers.map((c, i) => [randomUUID(), shopId, 1, '{}', userId, c[0], `Amp ${i}`, `SN${i}`, ''])
  const day = 86_400_000
  const jobs = Array.from({ length: n }, (_, i) => {
    const k = i % customers.length
    const updated = new Date(Date.now() - (i * 7919 % 365) * day)
    const promised = new Date(updated.getTime() + (i % 21) * day).toISOString().slice(0, 10)
    return [randomUUID(), shopId, 1, '{}', userId, customers[k]![0], amps[k]![0], `Hum and crackle ${i}`, '[]', promised, states[i % states.length], ['low', 'normal', 'rush'][i % 3], updated, updated]
  })
  await conn.query('insert into customers (id, shop_id, version, field_stamps, created_by, name, notes) values ?', [customers])
  await conn.query('insert into amps (id, shop_id, version, field_stamps, created_by, customer_id, description, serial, notes) values ?', [amps])
  await conn.query('insert into jobs (id, shop_id, version, field_stamps, created_by, customer_id, amp_id, complaint, photos, promised_for, status, priority, created_at, updated_at) values ?', [jobs])
  await conn.end()
}
