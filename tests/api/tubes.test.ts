import { randomUUID } from 'node:crypto'
import { beforeAll, describe, expect, it } from 'vitest'
import { client, login, ownerOfNewShop } from './helpers/client'
import type { Client } from './helpers/client'

const entry = (overrides: Record<string, unknown> = {}) => ({
  name: `Test 6V6 ${randomUUID().slice(0, 6)}`,
  maxPlateWatts: 14,
  maxScreenWatts: 2.2,
  maxPlateVolts: 350,
  heater: '6.3 V 0.45 A',
  ratingSystem: 'design-maximum',
  source: 'Shop copy of the maker\'s data sheet',
  ...overrides,
})

let owner: Client
let tech: Client
let desk: Client
let player: Client

beforeAll(async () => {
  [owner, tech, desk, player] = await Promise.all([
    login('owner@larkspur.example'),
    login('tech@larkspur.example'),
    login('desk@larkspur.example'),
    login('dana@players.example'),
  ])
})

const ids = (r: { body: { tubes: { id: string }[] } }) => r.body.tubes.map(t => t.id)

describe('GET /api/tubes', () => {
  it('lists the built-in tubes for every member, players included', async () => {
    for (const c of [owner, tech, desk, player]) {
      const r = await c.get('/api/tubes')
      expect(r.status).toBe(200)
      expect(ids(r)).toEqual(expect.arrayContaining(['6v6gt', '6v6gta', 'el84', 'kt66']))
      expect(r.body.tubes.find((t: { id: string }) => t.id === 'el84')).toMatchObject({ kind: 'builtin', maxPlateWatts: 12 })
    }
  })

  it('needs a signed-in user', async () => {
    expect((await client().get('/api/tubes')).status).toBe(401)
  })
})

describe('POST /api/tubes', () => {
  it('lets a tech and an owner add a shop entry that every member then sees', async () => {
    const a = await tech.post('/api/tubes', entry())
    expect(a.status).toBe(201)
    expect(a.body).toMatchObject({ kind: 'shop', maxPlateWatts: 14, maxScreenWatts: 2.2, ratingSystem: 'design-maximum' })
    const b = await owner.post('/api/tubes', entry({ maxScreenWatts: null }))
    expect(b.status).toBe(201)
    expect(b.body.maxScreenWatts).toBeNull()
    for (const c of [desk, player]) {
      expect(ids(await c.get('/api/tubes'))).toEqual(expect.arrayContaining([a.body.id, b.body.id]))
    }
  })

  it('keeps a client-made id, and refuses it twice', async () => {
    const id = randomUUID()
    const a = await tech.post('/api/tubes', entry({ id }))
    expect(a.status).toBe(201)
    expect(a.body.id).toBe(id)
    expect((await tech.post('/api/tubes', entry({ id }))).status).toBe(409)
  })

  it('refuses desk and player with 403', async () => {
    for (const c of [desk, player]) {
      const r = await c.post('/api/tubes', entry())
      expect(r.status).toBe(403)
    }
  })

  it('answers bad input with 400 and a message naming the field', async () => {
    const cases: [Record<string, unknown>, string][] = [
      [entry({ name: '' }), 'name'],
      [entry({ maxPlateWatts: -3 }), 'maxPlateWatts'],
      [entry({ maxPlateWatts: '14 W' }), 'maxPlateWatts'],
      [entry({ maxPlateVolts: undefined }), 'maxPlateVolts'],
      [entry({ ratingSystem: 'typical' }), 'ratingSystem'],
      [entry({ source: '' }), 'source'],
    ]
    for (const [body, field] of cases) {
      const r = await tech.post('/api/tubes', body)
      expect(r.status, field).toBe(400)
      expect(r.body.message, field).toMatch(new RegExp(`^${field}: `))
    }
  })
})

describe('PATCH and DELETE /api/tubes/[id]', () => {
  let id: string
  beforeAll(async () => {
    id = (await tech.post('/api/tubes', entry())).body.id
  })

  it('lets tech and owner edit a shop entry', async () => {
    const a = await tech.patch(`/api/tubes/${id}`, { maxPlateWatts: 12, ratingSystem: 'design-centre' })
    expect(a.status).toBe(200)
    expect(a.body).toMatchObject({ id, maxPlateWatts: 12, ratingSystem: 'design-centre', maxPlateVolts: 350 })
    const b = await owner.patch(`/api/tubes/${id}`, { heater: '6.3 V 0.5 A' })
    expect(b.status).toBe(200)
    expect(b.body.heater).toBe('6.3 V 0.5 A')
  })

  it('refuses desk and player with 403, for edit and retire', async () => {
    for (const c of [desk, player]) {
      expect((await c.patch(`/api/tubes/${id}`, { maxPlateWatts: 20 })).status).toBe(403)
      expect((await c.del(`/api/tubes/${id}`)).status).toBe(403)
    }
  })

  it('answers bad edits with 400 and built-in entries with 403', async () => {
    const empty = await tech.patch(`/api/tubes/${id}`, {})
    expect(empty.status).toBe(400)
    expect(empty.body.message).toMatch(/change at least one/)
    const bad = await tech.patch(`/api/tubes/${id}`, { maxPlateWatts: 0 })
    expect(bad.status).toBe(400)
    expect(bad.body.message).toMatch(/^maxPlateWatts: /)
    expect((await tech.patch('/api/tubes/6v6gt', { maxPlateWatts: 20 })).status).toBe(403)
    expect((await tech.del('/api/tubes/el84')).status).toBe(403)
  })

  it('answers an unknown id with 404', async () => {
    expect((await tech.patch(`/api/tubes/${randomUUID()}`, { maxPlateWatts: 20 })).status).toBe(404)
    expect((await tech.del(`/api/tubes/${randomUUID()}`)).status).toBe(404)
  })

  it('retires (soft delete): gone from the list, then 404', async () => {
    const doomed = (await owner.post('/api/tubes', entry())).body.id
    const r = await tech.del(`/api/tubes/${doomed}`)
    expect(r.status).toBe(200)
    expect(r.body).toEqual({ id: doomed, retired: true })
    expect(ids(await owner.get('/api/tubes'))).not.toContain(doomed)
    expect((await tech.del(`/api/tubes/${doomed}`)).status).toBe(404)
    expect((await tech.patch(`/api/tubes/${doomed}`, { maxPlateWatts: 20 })).status).toBe(404)
  })
})

describe('shop walls', () => {
  it('another shop\'s tube id answers 404, and lists never mix', async () => {
    const other = await ownerOfNewShop()
    const theirs = await other.client.post('/api/tubes', entry({ name: 'Their own EL34' }))
    expect(theirs.status).toBe(201)
    const ours = (await tech.post('/api/tubes', entry())).body.id

    expect((await tech.patch(`/api/tubes/${theirs.body.id}`, { maxPlateWatts: 99 })).status).toBe(404)
    expect((await owner.del(`/api/tubes/${theirs.body.id}`)).status).toBe(404)
    expect((await other.client.patch(`/api/tubes/${ours}`, { maxPlateWatts: 99 })).status).toBe(404)
    expect((await other.client.del(`/api/tubes/${ours}`)).status).toBe(404)

    expect(ids(await tech.get('/api/tubes'))).not.toContain(theirs.body.id)
    const theirList = ids(await other.client.get('/api/tubes'))
    expect(theirList).toContain(theirs.body.id)
    expect(theirList).not.toContain(ours)
    // Unchanged by the refused edit.
    const still = (await other.client.get('/api/tubes')).body.tubes.find((t: { id: string }) => t.id === theirs.body.id)
    expect(still.maxPlateWatts).toBe(14)
  })
})
