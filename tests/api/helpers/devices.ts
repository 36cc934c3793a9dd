// Devices for sync tests: the real client engine over fake-indexeddb, talking to the real server.
import 'fake-indexeddb/auto'
import { LocalDb } from '../../../app/utils/sync/local-db'
import { SyncEngine, type Transport } from '../../../app/utils/sync/engine'
import { client, login, type Client } from './client'

export interface Faults { dropRequest: number, dropResponse: number, duplicate: number }
export const NO_FAULTS: Faults = { dropRequest: 0, dropResponse: 0, duplicate: 0 }

/** A seeded PRNG (mulberry32) so a failing run can be repeated. */
export function prng(seed: number) {
  let a = seed >>> 0
  return () => {
    a = (a + 0x6D2B79F5) >>> 0
    let t = a
    t = Math.imul(t ^ (t >>> 15), t | 1)
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61)
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296
  }
}

export function transportFor(http: Client, faults: Faults = NO_FAULTS, rand = Math.random): Transport & { faults: Faults } {
  const t = (async (path: string, body: unknown) => {
    const f = t.faults
    const r = rand()
    if (r < f.dropRequest) throw new Error('network: request dropped')
    if (r < f.dropRequest + f.duplicate) {
      const [a, b] = await Promise.all([http.post(path, body), http.post(path, body)])
      return rand() < 0.5 ? a : b
    }
    const reply = await http.post(path, body)
    if (rand() < f.dropResponse) throw new Error('network: response lost after commit')
    return reply
  }) as Transport & { faults: Faults }
  t.faults = faults
  return t
}

let dbCounter = 0
export interface Device {
  http: Client
  db: LocalDb
  engine: SyncEngine
  transport: ReturnType<typeof transportFor>
  userId: string
  /** A killed tab: a new engine on the same on-device database. */
  restart: () => Promise<void>
}

export async function device(http: Client, shopId: string, opts: { faults?: Faults, rand?: () => number, now?: () => Date, dbName?: string, userId?: string } = {}): Promise<Device> {
  const userId = opts.userId ?? (await http.get('/api/auth/me')).body.user.id as string
  const db = new LocalDb(opts.dbName ?? `test-${process.pid}-${Date.now()}-${dbCounter++}`)
  const transport = transportFor(http, opts.faults ?? NO_FAULTS, opts.rand)
  const d: Device = {
    http, db, transport, userId,
    engine: new SyncEngine({ db, userId, shopId, transport, now: opts.now }),
    restart: async () => {
      d.engine = new SyncEngine({ db, userId, shopId, transport, now: opts.now })
      await d.engine.rebuild()
    },
  }
  return d
}

/** Retry a sync step through injected faults (bounded). */
export async function eventually<T>(fn: () => Promise<T>, tries = 50): Promise<T> {
  let last: unknown
  for (let i = 0; i < tries; i++) {
    try {
      return await fn()
    }
    catch (e) {
      last = e
    }
  }
  throw last
}

/** A fresh shop with an owner and `extra` invited techs, each signed in. */
export async function shopWithMembers(extra: number) {
  const { newOwner } = await import('./client')
  const owner = await newOwner('sync')
  const members: Client[] = [owner.c]
  for (let i = 0; i < extra; i++) {
    const email = `member-${Date.now()}-${i}-${Math.random().toString(36).slice(2, 6)}@test.example`
    const inv = await owner.c.post(`/api/shops/${owner.shopId}/invitations`, { email, role: 'tech' })
    const c = client()
    const r = await c.post('/api/auth/register', { email, name: `Member ${i}`, password: 'long-enough-pw', invitationToken: inv.body.link.split('/invite/')[1] })
    if (r.status !== 201) throw new Error(`member register ${r.status}`)
    members.push(c)
  }
  return { shopId: owner.shopId, members, login }
}
