import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { SYNC_SCHEMA_VERSION } from '../../shared/utils/sync/protocol'
import { computeTool, ENGINE_VERSION } from '../../shared/utils/bench'
import { BASE, client, DEMO, login, newOwner, type Client } from './helpers/client'
import { device } from './helpers/devices'
import { pushFromDevice, statuses, type PushResult } from './helpers/push'
import { sql } from './helpers/db'

type Result = PushResult
async function push(c: Client, shopId: string, changes: { name: string, args: unknown }[]): Promise<Result[]> {
  const r = await pushFromDevice(c, shopId, changes)
  expect(r.status, JSON.stringify(r.body)).toBe(200)
  return r.body.results
}

let n = 0
/** Someone invited to the shop with a role, signed in. */
async function member(owner: { c: Client, shopId: string }, role: 'tech' | 'desk' | 'player', name: string) {
  const email = `rigsug-${role}-${Date.now()}-${n++}@test.example`
  const inv = await owner.c.post(`/api/shops/${owner.shopId}/invitations`, { email, role })
  expect(inv.status).toBe(201)
  const c = client()
  const reg = await c.post('/api/auth/register', { email, name, password: 'correct-horse-battery', invitationToken: inv.body.link.split('/invite/')[1] })
  expect(reg.status).toBe(201)
  const me = (await c.get('/api/auth/me')).body
  return { c, userId: me.user.id as string, space: me.personalSpaceId as string }
}

const rig = (id: string, extra: Record<string, unknown> = {}) => ({
  name: 'rig.create',
  args: { id, description: 'two-6V6 combo, fixed bias', tubes: [{ position: 'V4', type: '6V6GT' }, { position: 'V5', type: '6V6GT' }], retubeHours: 300, retubeMonths: 12, ...extra },
})
const suggestion = (rigId: string, fields: Record<string, unknown> = {}) => ({
  name: 'rigSuggestion.create', args: { id: randomUUID(), rigId, retubeHours: 200, retubeMonths: 9, note: 'Plays loud.', ...fields },
})
const share = (id: string, rigId: string, shopId: string) => ({ name: 'rigShare.create', args: { id, rigId, sharedShopId: shopId } })

const secret = process.env.TW_TEST_RIG_REMINDER_SECRET ?? ''
async function runReminders(today: string, userId: string) {
  const res = await fetch(`${BASE}/api/rigs/reminders/run`, { method: 'POST', headers: { 'content-type': 'application/json', 'x-task-secret': secret }, body: JSON.stringify({ today, userId }) })
  expect(res.status).toBe(200)
  return ((await res.json()) as { sent: { threshold: string }[] }).sent.map(s => s.threshold)
}

describe('a shop suggests retube thresholds for a rig shared with it', () => {
  it('only owner or tech, only while shared; the player sees who suggested it and keeps their own until adopting', async () => {
    const owner = await newOwner('rigsug')
    const player = await member(owner, 'player', 'Rig Player')
    const tech = await member(owner, 'tech', 'Bench Tech')
    const desk = await member(owner, 'desk', 'Front Desk')
    const other = await member(owner, 'player', 'Other Player')
    const elsewhere = await newOwner('rigsug-else')
    const rigId = randomUUID()
    const shareId = randomUUID()
    expect(statuses(await push(player.c, player.space, [rig(rigId)]))).toEqual(['applied'])

    // Not shared yet: the server refuses the shop's suggestion.
    const early = await push(tech.c, owner.shopId, [suggestion(rigId)])
    expect(early[0]).toMatchObject({ status: 'rejected', reason: expect.stringMatching(/not shared with this shop/) })

    expect(statuses(await push(player.c, player.space, [share(shareId, rigId, owner.shopId)]))).toEqual(['applied'])
    // The device says it is someone else: the server writes who really suggested it.
    const first = suggestion(rigId, { suggestedBy: 'Somebody Else' })
    expect(statuses(await push(tech.c, owner.shopId, [first]))).toEqual(['applied'])
    const [row] = await sql<{ suggested_by: string, shop_id: string }>('select suggested_by, shop_id from rig_suggestions where id = ?', [first.args.id])
    expect(row).toEqual({ suggested_by: 'Bench Tech', shop_id: owner.shopId })

    const refused = await push(desk.c, owner.shopId, [suggestion(rigId)])
    expect(refused[0]).toMatchObject({ status: 'rejected', reason: expect.stringMatching(/your role may not create/) })
    const nothing = await push(owner.c, owner.shopId, [suggestion(rigId, { retubeHours: null, retubeMonths: null })])
    expect(nothing[0]).toMatchObject({ status: 'rejected', reason: 'suggest hours, months or both' })
    const foreign = await push(elsewhere.c, elsewhere.shopId, [suggestion(rigId)])
    expect(foreign[0]).toMatchObject({ status: 'rejected', reason: expect.stringMatching(/not shared with this shop/) })
    expect((await sql('select id from rig_suggestions where rig_id = ?', [rigId]))).toHaveLength(1)

    // The player: on the rig (online), and pulled with the shop (offline), with who and which shop.
    const detail = (await player.c.get(`/api/rigs/${rigId}`)).body
    expect(detail.suggestions).toHaveLength(1)
    expect(detail.suggestions[0]).toMatchObject({ retubeHours: 200, retubeMonths: 9, note: 'Plays loud.', suggestedBy: 'Bench Tech', shopId: owner.shopId })
    expect(detail.suggestions[0].shopName).toMatch(/^Test shop/)
    // Their own thresholds are untouched until they adopt.
    expect(detail).toMatchObject({ retubeHours: 300, retubeMonths: 12 })
    const phone = await device(player.c, owner.shopId, { userId: player.userId })
    await phone.engine.pull()
    expect((await phone.db.rigSuggestions.toArray()).map(s => [s.id, s.suggestedBy])).toEqual([[first.args.id, 'Bench Tech']])
    // Another player of the same shop pulls none of it; the shop's staff see it on the shared rig.
    const theirs = await device(other.c, owner.shopId, { userId: other.userId })
    await theirs.engine.pull()
    expect(await theirs.db.rigSuggestions.count()).toBe(0)
    expect((await other.c.get(`/api/rigs/${rigId}`)).status).toBe(404)
    expect((await owner.c.get(`/api/rigs/${rigId}`)).body.suggestions.map((s: { id: string }) => s.id)).toEqual([first.args.id])

    // Revoked: no more suggestions, and the shop sees nothing of the rig.
    expect(statuses(await push(player.c, player.space, [{ name: 'rigShare.delete', args: { id: shareId } }]))).toEqual(['applied'])
    const late = await push(tech.c, owner.shopId, [suggestion(rigId)])
    expect(late[0]).toMatchObject({ status: 'rejected', reason: expect.stringMatching(/not shared with this shop/) })
    expect((await owner.c.get(`/api/rigs/${rigId}`)).status).toBe(404)
  })

  it('the reminder follows the player\'s thresholds: a suggestion counts only once adopted', async () => {
    const owner = await newOwner('rigsug-remind')
    const player = await member(owner, 'player', 'Remind Player')
    const rigId = randomUUID()
    const gig = (playedOn: string, hours: number) => ({ name: 'rigGig.create', args: { id: randomUUID(), rigId, playedOn, hours } })
    expect(statuses(await push(player.c, player.space, [
      rig(rigId, { retubeHours: 300, retubeMonths: null }),
      { name: 'rigTubeSet.create', args: { id: randomUUID(), rigId, fittedOn: '2031-01-10' } },
      gig('2031-01-12', 8),
      share(randomUUID(), rigId, owner.shopId),
    ]))).toEqual(['applied', 'applied', 'applied', 'applied'])
    expect(statuses(await push(owner.c, owner.shopId, [suggestion(rigId, { retubeHours: 6, retubeMonths: null })]))).toEqual(['applied'])
    // 8 h played: past the shop's 6 h, short of the player's 300 h. Nothing is sent.
    expect(await runReminders('2031-01-13', player.userId)).toEqual([])
    // Adopted (one change to the player's own rig): now it is theirs, and the reminder goes once.
    expect(statuses(await push(player.c, player.space, [{ name: 'rig.setFields', args: { id: rigId, fields: { retubeHours: 6 } } }]))).toEqual(['applied'])
    expect(await runReminders('2031-01-14', player.userId)).toEqual(['hours'])
    expect(await runReminders('2031-01-15', player.userId)).toEqual([])
  })
})

describe('a bench result saved to a rig', () => {
  // Source: RCA RC-30 tube manual, 6V6GT typical operation: 285 V, 35 mA per tube.
  const inputs = { mode: 'fixed', maxPlateWatts: 14, plateVolts: 285, method: 'direct', amps: 0.035 }
  const result = (rigId: string) => ({
    name: 'measurement.create',
    args: { id: randomUUID(), tool: 'idle-dissipation', inputs, outputs: computeTool('idle-dissipation', inputs) as Record<string, unknown>, engineVersion: ENGINE_VERSION, rigId },
  })

  it('names the saver\'s own rig or one shared with the shop now; anything else is "rig not found"', async () => {
    const owner = await newOwner('rigbench')
    const player = await member(owner, 'player', 'Bench Player')
    const stranger = await newOwner('rigbench-else')
    const rigId = randomUUID()
    const gone = randomUUID()
    const shareId = randomUUID()
    expect(statuses(await push(player.c, player.space, [rig(rigId), rig(gone), { name: 'rig.delete', args: { id: gone } }]))).toEqual(['applied', 'applied', 'applied'])

    // The player's own rig, saved in their space or in the shop; a deleted rig is refused.
    expect(statuses(await push(player.c, player.space, [result(rigId)]))).toEqual(['applied'])
    expect(statuses(await push(player.c, owner.shopId, [result(rigId)]))).toEqual(['applied'])
    expect(await push(player.c, player.space, [result(gone)])).toMatchObject([{ status: 'rejected', reason: 'rig not found' }])
    // The shop: only while the rig is shared with it. A made-up id and an amp id are not rigs.
    expect(await push(owner.c, owner.shopId, [result(rigId)])).toMatchObject([{ status: 'rejected', reason: 'rig not found' }])
    expect(statuses(await push(player.c, player.space, [share(shareId, rigId, owner.shopId)]))).toEqual(['applied'])
    expect(statuses(await push(owner.c, owner.shopId, [result(rigId)]))).toEqual(['applied'])
    expect(await push(stranger.c, stranger.shopId, [result(rigId)])).toMatchObject([{ status: 'rejected', reason: 'rig not found' }])
    expect(await push(owner.c, owner.shopId, [result(randomUUID())])).toMatchObject([{ status: 'rejected', reason: 'rig not found' }])
    const [amp] = await sql<{ id: string }>('select id from amps where shop_id = ? limit 1', [DEMO.shopId])
    const tech = await login(DEMO.tech)
    expect(await push(tech, DEMO.shopId, [result(amp!.id)])).toMatchObject([{ status: 'rejected', reason: 'rig not found' }])
    expect(statuses(await push(player.c, player.space, [{ name: 'rigShare.delete', args: { id: shareId } }]))).toEqual(['applied'])
    expect(await push(owner.c, owner.shopId, [result(rigId)])).toMatchObject([{ status: 'rejected', reason: 'rig not found' }])
    expect(await sql('select id from measurements where rig_id = ?', [rigId])).toHaveLength(3)
  })
})

describe('deleting a rig', () => {
  it('the player deletes their own rig with its sets, gigs and shares; the shop stops seeing it; nobody else can', async () => {
    const owner = await newOwner('rigdel')
    const player = await member(owner, 'player', 'Delete Player')
    const rigId = randomUUID()
    const setId = randomUUID()
    const gigId = randomUUID()
    const shareId = randomUUID()
    expect(statuses(await push(player.c, player.space, [
      rig(rigId),
      { name: 'rigTubeSet.create', args: { id: setId, rigId, fittedOn: '2026-02-01' } },
      { name: 'rigGig.create', args: { id: gigId, rigId, playedOn: '2026-02-02', hours: 2 } },
      share(shareId, rigId, owner.shopId),
    ]))).toEqual(['applied', 'applied', 'applied', 'applied'])
    expect((await owner.c.get(`/api/rigs/${rigId}`)).status).toBe(200)
    // The shop may not delete it, in its own shop or in the player's space.
    expect(await push(owner.c, owner.shopId, [{ name: 'rig.delete', args: { id: rigId } }])).toMatchObject([{ status: 'rejected' }])
    const into = await owner.c.post('/api/sync/push', { clientId: randomUUID(), shopId: player.space, schemaVersion: SYNC_SCHEMA_VERSION, mutations: [{ id: 1, uuid: randomUUID(), name: 'rig.delete', args: { id: rigId } }] })
    expect(into.status).toBe(404)

    // As the rig page does it: the shares first, then gigs, sets and the rig.
    expect(statuses(await push(player.c, player.space, [
      { name: 'rigShare.delete', args: { id: shareId } },
      { name: 'rigGig.delete', args: { id: gigId } },
      { name: 'rigTubeSet.delete', args: { id: setId } },
      { name: 'rig.delete', args: { id: rigId } },
    ]))).toEqual(['applied', 'applied', 'applied', 'applied'])
    expect((await player.c.get(`/api/rigs/${rigId}`)).status).toBe(404)
    expect((await owner.c.get(`/api/rigs/${rigId}`)).status).toBe(404)
    expect((await player.c.get('/api/rigs')).body.items).toEqual([])
    const deleted = await sql<{ n: number }>(`select (select count(*) from rigs where id = ? and deleted_at is not null)
      + (select count(*) from rig_tube_sets where id = ? and deleted_at is not null) + (select count(*) from rig_gigs where id = ? and deleted_at is not null)
      + (select count(*) from rig_shares where id = ? and deleted_at is not null) as n`, [rigId, setId, gigId, shareId])
    expect(Number(deleted[0]!.n)).toBe(4)
  })
})
