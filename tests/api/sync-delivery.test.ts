import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { client, login } from './helpers/client'
import { device, eventually, shopWithMembers } from './helpers/devices'
import { notesOf, sameMap } from './helpers/soak'
import { sql } from './helpers/db'
import { secondServer } from './helpers/second-server'

describe('delivery', () => {
  it('8 concurrent pushers, 5,000 changes, a 9th device pulling every 50 ms ends equal to the server', async () => {
    const { shopId, members } = await shopWithMembers(8)
    const pushers = await Promise.all(members.slice(0, 8).map(m => device(m, shopId)))
    const watcher = await device(members[8]!, shopId)
    let done = false
    const watching = (async () => {
      while (!done) {
        await watcher.engine.pull()
        await new Promise(r => setTimeout(r, 50))
      }
    })()
    await Promise.all(pushers.map(async (d, i) => {
      for (let batch = 0; batch < 25; batch++) {
        for (let k = 0; k < 25; k++) await d.engine.mutate('note.create', { id: randomUUID(), jobId: null, body: `p${i} b${batch} k${k}` })
        await d.engine.push()
      }
    }))
    done = true
    await watching
    await watcher.engine.pull()
    const server = await notesOf(shopId)
    expect(server.size).toBe(5000)
    const seen = new Map((await watcher.db.notes.where('shopId').equals(shopId).toArray()).map(n => [n.id, `${n.title}|${n.body}`]))
    expect(sameMap(seen, server)).toBe(true)
  }, 480_000)

  it('keeps 100 pending changes through a 401 and delivers all 100 after signing in again', async () => {
    const { shopId, members } = await shopWithMembers(0)
    const owner = members[0]!
    const email = (await owner.get('/api/auth/me')).body.user.email
    const d = await device(owner, shopId)
    for (let i = 0; i < 100; i++) await d.engine.mutate('note.create', { id: randomUUID(), jobId: null, body: `offline ${i}` })
    await owner.post('/api/auth/logout')
    await expect(d.engine.push()).rejects.toMatchObject({ status: 401 })
    expect(await d.engine.pendingCount()).toBe(100)
    const again = await login(email, 'correct-horse-battery')
    owner.cookie = again.cookie
    const r = await d.engine.push()
    expect(r.results.filter(x => x.status === 'applied')).toHaveLength(100)
    expect(await d.engine.pendingCount()).toBe(0)
    expect((await notesOf(shopId)).size).toBe(100)
  })

  it('loses nothing and applies nothing twice when the server is killed mid-push, 100 times', async () => {
    const server = await secondServer()
    try {
      const { shopId, members } = await shopWithMembers(0)
      const http = client(server.base, members[0]!.cookie)
      const d = await device(http, shopId)
      const ids: string[] = []
      for (let i = 0; i < 100; i++) {
        const id = randomUUID()
        ids.push(id)
        await d.engine.mutate('note.create', { id, jobId: null, body: `kill ${i}` })
        const pushing = d.engine.push().catch(() => null)
        // Kill at a random point: before, during or after the request is handled.
        await new Promise(r => setTimeout(r, Math.random() * 15))
        server.kill()
        await pushing
        await server.start()
      }
      await eventually(() => d.engine.push())
      expect(await d.engine.pendingCount()).toBe(0)
      const rows = await sql<{ id: string }>('select id from notes where shop_id = ?', [shopId])
      expect(rows.map(r => r.id).sort()).toEqual([...ids].sort())
      const [log] = await sql<{ n: number, u: number }>('select count(*) n, count(distinct uuid) u from sync_mutations where client_id = ?', [(await d.engine.meta()).clientId])
      expect(Number(log!.n)).toBe(100)
      expect(Number(log!.u)).toBe(100)
    }
    finally {
      server.kill()
    }
  }, 480_000)

  it('answers 503 and changes nothing while the database is down; the device keeps its changes', async () => {
    const { shopId, members } = await shopWithMembers(0)
    const deadDb = (JSON.parse(process.env.TW_TEST_APP_ENV ?? '{}').NUXT_DATABASE_URL as string).replace(/:(\d+)\//, ':1/')
    const server = await secondServer({ NUXT_DATABASE_URL: deadDb })
    try {
      const userId = (await members[0]!.get('/api/auth/me')).body.user.id
      const d = await device(client(server.base, members[0]!.cookie), shopId, { userId })
      await d.engine.mutate('note.create', { id: randomUUID(), jobId: null, body: 'waits for the database' })
      await expect(d.engine.push()).rejects.toMatchObject({ status: 503 })
      expect(await d.engine.pendingCount()).toBe(1)
      expect((await notesOf(shopId)).size).toBe(0)
    }
    finally {
      server.kill()
    }
  })
})
