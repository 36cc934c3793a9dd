import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { SYNC_SCHEMA_VERSION } from '../../shared/utils/sync/protocol'
import { computeTool, ENGINE_VERSION } from '../../shared/utils/bench'
import { DEMO, login, newOwner, type Client } from './helpers/client'
import { sql } from './helpers/db'

const push = (c: Client, shopId: string, clientId: string, mutations: unknown[], schemaVersion = SYNC_SCHEMA_VERSION) =>
  c.post('/api/sync/push', { clientId, shopId, schemaVersion, mutations })
const pull = (c: Client, shopId: string, clientId: string, cookie: string | null = null) =>
  c.post('/api/sync/pull', { clientId, shopId, schemaVersion: SYNC_SCHEMA_VERSION, cookie })
/** Every page of a pull from `cookie` on: the demo shop holds more than one page while other suites add to it. */
async function pullAll(c: Client, shopId: string, clientId: string, cookie: string | null = null) {
  const changes: { id: string, table: string }[] = []
  for (;;) {
    const r = await pull(c, shopId, clientId, cookie)
    changes.push(...r.body.changes)
    cookie = r.body.cookie
    if (!r.body.more) return { changes, cookie }
  }
}
const noteCreate = (id: number, body = `note ${id}`, noteId = randomUUID()) => ({ id, uuid: randomUUID(), name: 'note.create', args: { id: noteId, jobId: null, body } })
const version = async (shopId: string) => Number((await sql<{ v: number }>('select version v from shop_versions where shop_id = ?', [shopId]))[0]?.v ?? 0)

describe('sync push', () => {
  it('applies the same body pushed 5 times concurrently exactly once, with one version bump', async () => {
    const { c, shopId } = await newOwner('dup')
    const clientId = randomUUID()
    await push(c, shopId, clientId, [])
    const before = await version(shopId)
    const body = [noteCreate(1, 'only once')]
    const replies = await Promise.all(Array.from({ length: 5 }, () => push(c, shopId, clientId, body)))
    expect(replies.map(r => r.status)).toEqual([200, 200, 200, 200, 200])
    const statuses = replies.map(r => r.body.results[0].status).sort()
    expect(statuses).toEqual(['applied', 'duplicate', 'duplicate', 'duplicate', 'duplicate'])
    expect(await version(shopId)).toBe(before + 1)
    const rows = await sql('select id from notes where shop_id = ? and body = ?', [shopId, 'only once'])
    expect(rows).toHaveLength(1)
  })

  it('answers 422 when a mutation number is reused with another payload', async () => {
    const { c, shopId } = await newOwner('reuse')
    const clientId = randomUUID()
    expect((await push(c, shopId, clientId, [noteCreate(1)])).status).toBe(200)
    const r = await push(c, shopId, clientId, [noteCreate(1, 'different')])
    expect(r.status).toBe(422)
  })

  it('answers 426 for an unknown mutation or schema version and applies nothing', async () => {
    const { c, shopId } = await newOwner('426')
    const clientId = randomUUID()
    const r1 = await push(c, shopId, clientId, [noteCreate(1), { id: 2, uuid: randomUUID(), name: 'note.teleport', args: {} }])
    expect(r1.status).toBe(426)
    expect(await sql('select * from notes where shop_id = ?', [shopId])).toHaveLength(0)
    expect((await push(c, shopId, clientId, [noteCreate(1)], SYNC_SCHEMA_VERSION + 1)).status).toBe(426)
  })

  it('stops at a gap and applies nothing past it', async () => {
    const { c, shopId } = await newOwner('gap')
    const clientId = randomUUID()
    const r = await push(c, shopId, clientId, [noteCreate(1), noteCreate(3)])
    expect(r.body.lmid).toBe(1)
    expect(r.body.results.map((x: { id: number }) => x.id)).toEqual([1])
  })

  it('logs a rejected mutation with its reason and keeps the queue moving', async () => {
    const { c, shopId } = await newOwner('reject')
    const clientId = randomUUID()
    const inputs = { mode: 'fixed', maxPlateWatts: 14, plateVolts: 285, method: 'direct', amps: 0.035 }
    const outputs = computeTool('idle-dissipation', inputs) as Record<string, unknown>
    const tampered = { ...outputs, watts: 5 }
    const bad = { id: 1, uuid: randomUUID(), name: 'measurement.create', args: { id: randomUUID(), tool: 'idle-dissipation', inputs, outputs: tampered, engineVersion: ENGINE_VERSION } }
    const r = await push(c, shopId, clientId, [
      bad,
      { id: 2, uuid: randomUUID(), name: 'note.setFields', args: { id: randomUUID(), fields: { body: 'x' } }, baseVersion: 0 },
      noteCreate(3),
    ])
    expect(r.status).toBe(200)
    expect(r.body.lmid).toBe(3)
    expect(r.body.results.map((x: { status: string }) => x.status)).toEqual(['rejected', 'rejected', 'applied'])
    expect(r.body.results[0].reason).toMatch(/does not match its inputs/)
    expect(r.body.results[1].reason).toMatch(/not found/)
    const logged = await sql<{ status: string, reason: string }>('select status, reason from sync_mutations where client_id = ? order by mutation_id', [clientId])
    expect(logged.map(l => l.status)).toEqual(['rejected', 'rejected', 'applied'])
    // Re-sent after a lost reply: it says what happened the first time.
    const again = await push(c, shopId, clientId, [bad])
    expect(again.body.results[0]).toMatchObject({ id: 1, status: 'duplicate', was: 'rejected' })
  })

  it('accepts a measurement whose outputs match its inputs', async () => {
    const tech = await login(DEMO.tech)
    const clientId = randomUUID()
    // Source: RCA RC-30 tube manual, 6V6GT typical operation: 285 V, 35 mA per tube.
    const inputs = { mode: 'fixed', maxPlateWatts: 14, plateVolts: 285, method: 'direct', amps: 0.035 }
    const outputs = computeTool('idle-dissipation', inputs) as Record<string, unknown>
    const id = randomUUID()
    const r = await push(tech, DEMO.shopId, clientId, [{ id: 1, uuid: randomUUID(), name: 'measurement.create', args: { id, tool: 'idle-dissipation', inputs, outputs, engineVersion: ENGINE_VERSION } }])
    expect(r.body.results[0].status).toBe('applied')
    const [row] = await sql<{ tool: string, created_by: string }>('select tool, created_by from measurements where id = ?', [id])
    expect(row!.tool).toBe('idle-dissipation')
  })

  it('refuses a device id that belongs to another user (403) and another shop (404)', async () => {
    const a = await newOwner('owner-a')
    const b = await newOwner('owner-b')
    const clientId = randomUUID()
    await push(a.c, a.shopId, clientId, [])
    expect((await push(b.c, b.shopId, clientId, [])).status).toBe(403)
    expect((await push(b.c, a.shopId, randomUUID(), [])).status).toBe(404)
    expect((await pull(b.c, a.shopId, randomUUID())).status).toBe(404)
  })

  it('answers 400 for malformed bodies and 401 without a session', async () => {
    const { c, shopId } = await newOwner('bad')
    expect((await c.post('/api/sync/push', { clientId: 'x', shopId, schemaVersion: 1, mutations: [] })).status).toBe(400)
    expect((await c.post('/api/sync/pull', { shopId })).status).toBe(400)
    const { client } = await import('./helpers/client')
    const anon = await client().post('/api/sync/push', { clientId: randomUUID(), shopId, schemaVersion: 1, mutations: [] })
    expect(anon.status).toBe(401)
    expect(anon.headers.get('location')).toBeNull()
  })
})

describe('sync pull', () => {
  it('pages by shop version, keeps tombstones, and hides one shop from another', async () => {
    const { c, shopId } = await newOwner('pull')
    const clientId = randomUUID()
    const ids = Array.from({ length: 3 }, () => randomUUID())
    await push(c, shopId, clientId, ids.map((nid, i) => noteCreate(i + 1, `n${i}`, nid)))
    await push(c, shopId, clientId, [{ id: 4, uuid: randomUUID(), name: 'note.delete', args: { id: ids[0] }, baseVersion: 3 }])
    const first = await pull(c, shopId, clientId)
    expect(first.body.reset).toBe(true)
    expect(first.body.lmid).toBe(4)
    const byId = new Map(first.body.changes.map((ch: { id: string }) => [ch.id, ch]))
    expect((byId.get(ids[0]) as { deleted: boolean }).deleted).toBe(true)
    expect((byId.get(ids[1]) as { data: { body: string } }).data.body).toBe('n1')
    const again = await pull(c, shopId, clientId, first.body.cookie)
    expect(again.body.reset).toBe(false)
    expect(again.body.changes).toEqual([])

    const other = await newOwner('other')
    const seen = await pull(other.c, other.shopId, randomUUID())
    expect(seen.body.changes.filter((ch: { id: string }) => ids.includes(ch.id))).toEqual([])
  })

  it('lets another member of the shop see a note, resets after a role change, and shows players only their own', async () => {
    const tech = await login(DEMO.tech)
    const owner = await login(DEMO.owner)
    const dana = await login(DEMO.dana)
    const noteId = randomUUID()
    await push(tech, DEMO.shopId, randomUUID(), [noteCreate(1, 'visible to the shop', noteId)])
    const ownerView = await pullAll(owner, DEMO.shopId, randomUUID())
    expect(ownerView.changes.some(ch => ch.id === noteId)).toBe(true)
    const danaClient = randomUUID()
    const danaView = await pullAll(dana, DEMO.shopId, danaClient)
    expect(danaView.changes.some(ch => ch.id === noteId)).toBe(false)
    const danaNote = randomUUID()
    await push(dana, DEMO.shopId, danaClient, [noteCreate(1, 'my own', danaNote)])
    // Other suites may add jobs of Dana's meanwhile; of the notes she sees only her own new one.
    const danaAgain = await pullAll(dana, DEMO.shopId, danaClient, danaView.cookie)
    expect(danaAgain.changes.filter(ch => ch.table === 'notes').map(ch => ch.id)).toEqual([danaNote])

    // Role change: the next pull starts over.
    const { newOwner: mk } = await import('./helpers/client')
    const shop = await mk('roles-sync')
    const member = await mk('member-sync')
    const inv = await shop.c.post(`/api/shops/${shop.shopId}/invitations`, { email: member.email, role: 'tech' })
    await member.c.post(`/api/invitations/${inv.body.link.split('/invite/')[1]}/accept`)
    const mClient = randomUUID()
    const p1 = await pull(member.c, shop.shopId, mClient)
    expect((await pull(member.c, shop.shopId, mClient, p1.body.cookie)).body.reset).toBe(false)
    await shop.c.patch(`/api/shops/${shop.shopId}/members/${member.userId}`, { role: 'player' })
    expect((await pull(member.c, shop.shopId, mClient, p1.body.cookie)).body.reset).toBe(true)
  })
})
