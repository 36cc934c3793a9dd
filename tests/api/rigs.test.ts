import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { SYNC_SCHEMA_VERSION } from '../../shared/utils/sync/protocol'
import { BASE, client, DEMO, login, newOwner } from './helpers/client'
import { caughtMail, waitForMail } from './helpers/mail'
import { device } from './helpers/devices'
import { pushFromDevice, statuses } from './helpers/push'

const push = pushFromDevice

let n = 0
/** A signed-in person with no shop at all. */
async function loner(prefix = 'player') {
  const c = client()
  const r = await c.post('/api/auth/register', { email: `${prefix}-${Date.now()}-${n++}@test.example`, name: `Test ${prefix}`, password: 'correct-horse-battery' })
  expect(r.status).toBe(201)
  const me = await c.get('/api/auth/me')
  return { c, userId: me.body.user.id as string, space: me.body.personalSpaceId as string, me: me.body }
}

/** A shop owner and a player invited to that shop, each signed in, and the player's personal space. */
async function shopAndPlayer() {
  const owner = await newOwner('rigshop')
  const email = `rigplayer-${Date.now()}-${n++}@test.example`
  const inv = await owner.c.post(`/api/shops/${owner.shopId}/invitations`, { email, role: 'player' })
  expect(inv.status).toBe(201)
  const player = client()
  const reg = await player.post('/api/auth/register', { email, name: 'Rig Player', password: 'correct-horse-battery', invitationToken: inv.body.link.split('/invite/')[1] })
  expect(reg.status).toBe(201)
  const me = await player.get('/api/auth/me')
  return { owner, player, playerId: me.body.user.id as string, space: me.body.personalSpaceId as string }
}

const rigArgs = (id = randomUUID()) => ({
  id, description: 'two-6V6 combo, fixed bias', serial: 'T-1', biasMode: 'fixed',
  tubes: [{ position: 'V4', type: '6V6GT' }, { position: 'V5', type: '6V6GT' }], speakerLoadOhms: 8, outputTapOhms: 8, retubeHours: 300, retubeMonths: 12,
})

describe('a personal space for every user', () => {
  it('is made on demand, kept out of the shops, and no shop route acts on it', async () => {
    const p = await loner()
    expect(p.space).toMatch(/^[0-9a-f-]{36}$/)
    expect(p.me.memberships).toEqual([])
    expect(p.me.activeShop).toBeNull()
    // Asked again: the same space, never a second one.
    expect((await p.c.get('/api/auth/me')).body.personalSpaceId).toBe(p.space)
    expect((await p.c.post('/api/auth/active-shop', { shopId: p.space })).status).toBe(404)
    expect((await p.c.get(`/api/shops/${p.space}/members`)).status).toBe(404)
    expect((await p.c.post(`/api/shops/${p.space}/invitations`, { email: 'x@test.example', role: 'tech' })).status).toBe(404)
    // A shop's records cannot be kept there as if it were a shop either (no active shop: 409).
    expect((await p.c.get('/api/jobs')).status).toBe(409)
  })
})

describe('a player with no shop keeps rigs and syncs them', () => {
  it('creates a rig, a tube set and a gig offline, syncs them, and a second device pulls them', async () => {
    const p = await loner()
    const d1 = await device(p.c, p.space, { userId: p.userId })
    const rigId = randomUUID()
    const setId = randomUUID()
    await d1.engine.mutate('rig.create', rigArgs(rigId))
    await d1.engine.mutate('rigTubeSet.create', {
      id: setId, rigId, fittedOn: '2026-01-10', fittedBy: 'me', tubes: [{ position: 'V4', type: '6V6GT' }, { position: 'V5', type: '6V6GT' }],
      readings: [{ on: '2026-01-10', position: 'V4', mA: 22, plateVolts: 340 }, { on: '2026-01-10', position: 'V5', mA: 24, plateVolts: null }],
    })
    await d1.engine.mutate('rigGig.create', { id: randomUUID(), rigId, playedOn: '2026-01-20', hours: 2.5 })
    expect(await d1.db.rigs.get(rigId)).toMatchObject({ description: 'two-6V6 combo, fixed bias', pending: 1 })
    const { pushed } = await d1.engine.sync()
    expect(pushed.results.map(r => r.status)).toEqual(['applied', 'applied', 'applied'])
    expect(await d1.db.rigs.get(rigId)).toMatchObject({ version: expect.any(Number), pending: 0 })

    const d2 = await device(p.c, p.space, { userId: p.userId })
    await d2.engine.sync()
    expect(await d2.db.rigs.get(rigId)).toMatchObject({ serial: 'T-1', retubeHours: 300 })
    expect((await d2.db.rigTubeSets.get(setId))?.readings).toHaveLength(2)
    expect(await d2.db.rigGigs.where('rigId').equals(rigId).count()).toBe(1)

    const list = await p.c.get('/api/rigs')
    expect(list.status).toBe(200)
    expect(list.body.items.map((r: { id: string, access: string }) => [r.id, r.access])).toEqual([[rigId, 'own']])
    const one = await p.c.get(`/api/rigs/${rigId}`)
    expect(one.status).toBe(200)
    expect(one.body.sets.map((s: { id: string }) => s.id)).toEqual([setId])
    expect(one.body.gigs[0]).toMatchObject({ playedOn: '2026-01-20', hours: 2.5 })
  })

  it('refuses a rig that is not valid, and a set for a rig that is not in the space', async () => {
    const p = await loner()
    const r = await push(p.c, p.space, [
      { name: 'rig.create', args: { ...rigArgs(), description: '' } },
      { name: 'rigGig.create', args: { id: randomUUID(), rigId: randomUUID(), playedOn: '2026-01-20', hours: 2 } },
      { name: 'rigGig.create', args: { id: randomUUID(), rigId: randomUUID(), playedOn: '2026-01-20', hours: 30 } },
    ])
    expect(r.status).toBe(200)
    expect(statuses(r.body.results)).toEqual(['rejected', 'rejected', 'rejected'])
    expect(r.body.results[1].reason).toMatch(/rig not found/)
  })

  it('another person sees nothing of them, and cannot write into the space', async () => {
    const p = await loner()
    const rigId = randomUUID()
    expect(statuses((await push(p.c, p.space, [{ name: 'rig.create', args: rigArgs(rigId) }])).body.results)).toEqual(['applied'])
    const other = await loner('other')
    expect((await other.c.get(`/api/rigs/${rigId}`)).status).toBe(404)
    expect((await other.c.get('/api/rigs')).body.items).toEqual([])
    expect((await push(other.c, p.space, [{ name: 'rig.create', args: rigArgs() }])).status).toBe(404)
    const pull = await other.c.post('/api/sync/pull', { clientId: randomUUID(), shopId: p.space, schemaVersion: SYNC_SCHEMA_VERSION, cookie: null })
    expect(pull.status).toBe(404)
    const own = await other.c.post('/api/sync/pull', { clientId: randomUUID(), shopId: other.space, schemaVersion: SYNC_SCHEMA_VERSION, cookie: null })
    expect(own.status).toBe(200)
    expect(own.body.changes).toEqual([])
    // A demo player (a member of the demo shop) sees none of them either.
    const dana = await login(DEMO.dana)
    expect((await dana.get(`/api/rigs/${rigId}`)).status).toBe(404)
  })

  it('keeps rigs out of shops: a rig pushed to a shop is refused', async () => {
    const owner = await newOwner('norigs')
    const r = await push(owner.c, owner.shopId, [{ name: 'rig.create', args: rigArgs() }])
    expect(r.status).toBe(200)
    expect(r.body.results[0].status).toBe('rejected')
  })
})

describe('sharing a rig with a shop', () => {
  it('is invisible to the shop until shared, visible while shared, and invisible again after revoking', async () => {
    const { owner, player, space } = await shopAndPlayer()
    const rigId = randomUUID()
    const shareId = randomUUID()
    expect(statuses((await push(player, space, [
      { name: 'rig.create', args: rigArgs(rigId) },
      { name: 'rigTubeSet.create', args: { id: randomUUID(), rigId, fittedOn: '2026-02-01', readings: [{ on: '2026-02-01', position: 'V4', mA: 23, plateVolts: 345 }] } },
    ])).body.results)).toEqual(['applied', 'applied'])

    expect((await owner.c.get(`/api/rigs/${rigId}`)).status).toBe(404)
    expect((await owner.c.get('/api/rigs')).body.items).toEqual([])
    // Not shared: the shop cannot link an amp to it.
    const customer = await owner.c.post('/api/customers', { name: 'Rig Player' })
    expect(customer.status).toBe(201)
    const early = await owner.c.post('/api/amps', { customerId: customer.body.id, description: 'two-6V6 combo', rigId })
    expect(early.status).toBe(400)
    expect(early.body.message).toMatch(/not shared with this shop/)

    expect(statuses((await push(player, space, [{ name: 'rigShare.create', args: { id: shareId, rigId, sharedShopId: owner.shopId } }])).body.results)).toEqual(['applied'])
    const list = await owner.c.get('/api/rigs')
    expect(list.body.items).toHaveLength(1)
    expect(list.body.items[0]).toMatchObject({ id: rigId, access: 'shared', playerName: 'Rig Player' })
    const seen = await owner.c.get(`/api/rigs/${rigId}`)
    expect(seen.status).toBe(200)
    expect(seen.body.sets[0].readings[0]).toMatchObject({ position: 'V4', mA: 23 })
    // The shop sees the rig, never the player's other shares or history.
    expect(seen.body.shares).toEqual([])

    // Check-in: the shop's amp linked to the shared rig, a job on it, a note for the customer and one internal.
    const amp = await owner.c.post('/api/amps', { customerId: customer.body.id, description: 'two-6V6 combo', rigId })
    expect(amp.status, JSON.stringify(amp.body)).toBe(201)
    const job = await owner.c.post('/api/jobs', { customerId: customer.body.id, ampId: amp.body.id, complaint: 'Hum at idle.' })
    expect(job.status).toBe(201)
    const jobId = job.body.id
    expect((await push(owner.c, owner.shopId, [
      { name: 'note.create', args: { id: randomUUID(), jobId, title: 'For you', body: 'Filter caps replaced.', visibility: 'customer' } },
      { name: 'note.create', args: { id: randomUUID(), jobId, title: 'Internal', body: 'Customer haggles.', visibility: 'internal' } },
    ])).status).toBe(200)

    const mine = await player.get(`/api/rigs/${rigId}`)
    expect(mine.status).toBe(200)
    expect(mine.body.shares.map((s: { id: string }) => s.id)).toEqual([shareId])
    expect(mine.body.history).toHaveLength(1)
    const h = mine.body.history[0]
    expect(h).toMatchObject({ id: jobId, status: 'checked-in' })
    expect(h.notes.map((x: { body: string }) => x.body)).toEqual(['Filter caps replaced.'])
    // Status, dates, readings and customer notes only: not the complaint, parts or internal notes.
    expect(h.complaint).toBeUndefined()
    expect(Object.keys(h).sort()).toEqual(['createdAt', 'id', 'notes', 'promisedFor', 'readings', 'shopId', 'shopName', 'status', 'updatedAt'])

    // Revoke: the shop sees nothing of the rig again.
    expect(statuses((await push(player, space, [{ name: 'rigShare.delete', args: { id: shareId } }])).body.results)).toEqual(['applied'])
    expect((await owner.c.get(`/api/rigs/${rigId}`)).status).toBe(404)
    expect((await owner.c.get('/api/rigs')).body.items).toEqual([])
  })

  it('refuses a share with a shop the player does not belong to, and a share into a shop space', async () => {
    const { player, space } = await shopAndPlayer()
    const elsewhere = await newOwner('notmine')
    const rigId = randomUUID()
    const r = await push(player, space, [
      { name: 'rig.create', args: rigArgs(rigId) },
      { name: 'rigShare.create', args: { id: randomUUID(), rigId, sharedShopId: elsewhere.shopId } },
      { name: 'rigShare.create', args: { id: randomUUID(), rigId, sharedShopId: space } },
    ])
    expect(statuses(r.body.results)).toEqual(['applied', 'rejected', 'rejected'])
    expect(r.body.results[1].reason).toMatch(/only with a shop you belong to/)
    expect((await elsewhere.c.get(`/api/rigs/${rigId}`)).status).toBe(404)
  })

  it('has the demo: Dana\'s combo is shared with Larkspur Amp Works and linked to its amp; Sam\'s rig is not', async () => {
    const dana = await login(DEMO.dana)
    const mine = (await dana.get('/api/rigs')).body.items as { id: string, description: string, access: string }[]
    expect(mine.length).toBeGreaterThanOrEqual(2)
    const combo = mine.find(r => r.description.startsWith('18 W two-EL84'))!
    const detail = (await dana.get(`/api/rigs/${combo.id}`)).body
    expect(detail.sets.length).toBeGreaterThanOrEqual(2)
    expect(detail.gigs.length).toBeGreaterThan(5)
    expect(detail.shares[0]).toMatchObject({ sharedShopId: DEMO.shopId, shopName: 'Larkspur Amp Works' })
    expect(detail.history.length).toBeGreaterThanOrEqual(1)

    const desk = await login(DEMO.desk)
    const shared = (await desk.get('/api/rigs')).body.items as { id: string }[]
    expect(shared.map(r => r.id)).toEqual([combo.id])
    const sam = await login(DEMO.sam)
    const samRigs = (await sam.get('/api/rigs')).body.items as { id: string }[]
    expect(samRigs.length).toBeGreaterThanOrEqual(1)
    expect((await desk.get(`/api/rigs/${samRigs[0]!.id}`)).status).toBe(404)
  })
})

describe('retube reminders', () => {
  const secret = process.env.TW_TEST_RIG_REMINDER_SECRET ?? ''
  const run = async (body: Record<string, unknown>, key = secret) => {
    const res = await fetch(`${BASE}/api/rigs/reminders/run`, { method: 'POST', headers: { 'content-type': 'application/json', 'x-task-secret': key }, body: JSON.stringify(body) })
    return { status: res.status, body: await res.json() as { sent: { threshold: string, setId: string }[] } }
  }
  const thresholds = (r: { body: { sent: { threshold: string }[] } }) => r.body.sent.map(s => s.threshold)

  it('can be run only with the task secret', async () => {
    expect(secret.length).toBeGreaterThan(10)
    expect((await run({}, '')).status).toBe(404)
    expect((await run({}, 'x'.repeat(secret.length))).status).toBe(404)
    expect((await run({ today: 'tomorrow' })).status).toBe(400)
  })

  it('e-mails the player once at each threshold of each fitted set', async () => {
    const p = await loner('retube')
    const email = p.me.user.email as string
    const rigId = randomUUID()
    const first = randomUUID()
    const gig = (playedOn: string, hours: number) => ({ name: 'rigGig.create', args: { id: randomUUID(), rigId, playedOn, hours } })
    expect(statuses((await push(p.c, p.space, [
      { name: 'rig.create', args: { ...rigArgs(rigId), retubeHours: 5, retubeMonths: 2 } },
      { name: 'rigTubeSet.create', args: { id: first, rigId, fittedOn: '2030-01-15' } },
      gig('2030-01-20', 3),
    ])).body.results)).toEqual(['applied', 'applied', 'applied'])
    const mine = () => caughtMail().filter(m => m.to.includes(email))

    // 3 h of 5, 0 months of 2: nothing yet.
    expect(thresholds(await run({ today: '2030-01-21', userId: p.userId }))).toEqual([])
    // 3 + 2.5 = 5.5 h: the hours reminder, once.
    await push(p.c, p.space, [gig('2030-02-01', 2.5)])
    const hours = await run({ today: '2030-02-02', userId: p.userId })
    expect(hours.status).toBe(200)
    expect(hours.body.sent).toEqual([{ rigId, setId: first, threshold: 'hours' }])
    const mail = await waitForMail(email)
    expect(mail.raw).toContain('Retube reminder')
    expect(mail.raw).toContain('5.5 hours played on this set')
    expect(mail.raw).toMatch(/qualified people/)
    expect(thresholds(await run({ today: '2030-02-03', userId: p.userId }))).toEqual([])
    // Two whole months on 2030-03-15, not the day before (common calendar months, see the unit tests).
    expect(thresholds(await run({ today: '2030-03-14', userId: p.userId }))).toEqual([])
    expect(thresholds(await run({ today: '2030-03-15', userId: p.userId }))).toEqual(['months'])
    expect(thresholds(await run({ today: '2030-03-16', userId: p.userId }))).toEqual([])
    expect(mine()).toHaveLength(2)

    // A new set starts over: its own reminders, once each.
    const second = randomUUID()
    await push(p.c, p.space, [
      { name: 'rigTubeSet.setFields', args: { id: first, fields: { retiredOn: '2030-03-20' } } },
      { name: 'rigTubeSet.create', args: { id: second, rigId, fittedOn: '2030-03-20' } },
      gig('2030-03-22', 6),
    ])
    const again = await run({ today: '2030-03-23', userId: p.userId })
    expect(again.body.sent).toEqual([{ rigId, setId: second, threshold: 'hours' }])
    expect(thresholds(await run({ today: '2030-03-24', userId: p.userId }))).toEqual([])
    expect(mine()).toHaveLength(3)
  })
})
