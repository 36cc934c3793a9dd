import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { client } from './helpers/client'
import { device, shopWithMembers } from './helpers/devices'
import { notesOf, sameMap } from './helpers/soak'
import { sql } from './helpers/db'
import { secondServer } from './helpers/second-server'

describe('two app nodes, one shop', () => {
  it('stamps every change with its own shop version, without a gap, when two nodes push at once', async () => {
    const { shopId, members } = await shopWithMembers(3)
    const other = await secondServer()
    try {
      // Devices 0 and 2 push through this node, 1 and 3 through the second one.
      const devices = await Promise.all(members.map((m, i) => device(i % 2 ? client(other.base, m.cookie) : m, shopId)))
      await Promise.all(devices.map(async (d, i) => {
        for (let batch = 0; batch < 10; batch++) {
          for (let k = 0; k < 5; k++) await d.engine.mutate('note.create', { id: randomUUID(), jobId: null, body: `d${i} b${batch} k${k}` })
          await d.engine.push()
        }
      }))
      const ids = await Promise.all(devices.map(async d => (await d.engine.meta()).clientId))
      const [v] = await sql<{ n: number, d: number, lo: number, hi: number }>(
        'select count(*) n, count(distinct version) d, min(version) lo, max(version) hi from sync_mutations where client_id in (?) and status = ?', [ids, 'applied'])
      const [shop] = await sql<{ version: number }>('select version from shop_versions where shop_id = ?', [shopId])
      expect(Number(v!.n)).toBe(200)
      expect(Number(v!.d)).toBe(200)
      expect(Number(v!.hi) - Number(v!.lo) + 1).toBe(200)
      expect(Number(v!.hi)).toBe(Number(shop!.version))
      // A pull through either node sees all of it.
      await devices[1]!.engine.pull()
      const seen = new Map((await devices[1]!.db.notes.where('shopId').equals(shopId).toArray()).map(n => [n.id, `${n.title}|${n.body}`]))
      expect(sameMap(seen, await notesOf(shopId))).toBe(true)
      expect(seen.size).toBe(200)
    }
    finally {
      other.kill()
    }
  }, 120_000)
})
