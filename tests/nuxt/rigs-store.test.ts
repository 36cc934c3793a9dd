import { describe, expect, it } from 'vitest'
import { fakeSyncServer, SHOP_ID, until } from './helpers/device'
import { useRigsStore } from '~/stores/rigs'
import { useSessionStore } from '~/stores/session'
import { useSyncStore } from '~/stores/sync'
import { useNotesStore } from '~/stores/notes'
import { startSync } from '~/utils/sync/start'

const SPACE = '6f1c2a10-0000-4000-8000-00000000b001'
const tubes = [{ position: 'V4', type: '6V6GT' }, { position: 'V5', type: '6V6GT' }]

/** A player signed in on the device, with or without a shop, and their own space. */
function signInPlayer(withShop: boolean) {
  // No page here to start sync after its first paint, so start it before the user arrives (as signInLocally does).
  startSync()
  const user = { id: crypto.randomUUID(), name: 'Dana Whitlow', email: 'dana@players.example' }
  useSessionStore().me = {
    user,
    memberships: withShop ? [{ shopId: SHOP_ID, shopName: 'Larkspur Amp Works', role: 'player' }] : [],
    personalSpaceId: SPACE,
    activeShop: withShop ? { id: SHOP_ID, name: 'Larkspur Amp Works', role: 'player' } : null,
  }
  return user
}

describe('rigs store (offline, on the device)', () => {
  it('keeps a player\'s rig, sets, readings and gigs with no shop and no network, queued in their own space', async () => {
    fakeSyncServer().mode = 'down'
    const user = signInPlayer(false)
    const sync = useSyncStore()
    const rigs = useRigsStore()
    await until(() => !!sync.personal && rigs.loaded, 'the personal engine to start')
    expect(sync.engine).toBeNull()

    const rigId = await rigs.create({ description: 'two-6V6 combo, fixed bias', tubes, retubeHours: 5, retubeMonths: 12 })
    const setId = await rigs.fitSet({ rigId, fittedOn: '2026-01-10', fittedBy: 'me', tubes })
    await rigs.addReadings(setId, [{ on: '2026-01-10', position: 'V4', mA: 22, plateVolts: 340 }])
    await rigs.addReadings(setId, [{ on: '2026-03-01', position: 'V4', mA: 21, plateVolts: null }])
    await rigs.logGig(rigId, 3, '2026-02-01')
    await rigs.logGig(rigId, 2.5, '2026-02-08')

    const queued = await sync.db!.outbox.where('shopId').equals(SPACE).sortBy('id')
    expect(queued.map(m => m.name)).toEqual(['rig.create', 'rigTubeSet.create', 'rigTubeSet.setFields', 'rigTubeSet.setFields', 'rigGig.create', 'rigGig.create'])
    expect(await sync.db!.outbox.where('shopId').equals(SHOP_ID).count()).toBe(0)

    await until(() => rigs.gigsOf(rigId).length === 2 && rigs.readingsOf(rigId).length === 2, 'the rig to show')
    const rig = rigs.byId(rigId)!
    expect(rig.createdBy).toBe(user.id)
    expect(rig.pending).toBe(1)
    expect(rigs.readingsOf(rigId).map(r => r.mA)).toEqual([22, 21])
    // 3 + 2.5 h played since the set went in, against the player's 5 h: due on the device.
    const reminder = rigs.reminderOf(rig, '2026-02-09')
    expect(reminder.status?.hoursPlayed).toBe(5.5)
    expect(reminder.due.map(d => d.threshold)).toEqual(['hours'])
    expect(rigs.reminderOf(rig, '2026-02-02').due).toEqual([])
    await until(() => sync.pending === 6, 'six changes waiting to be sent')

    // The data survives a reload of the store (it is in IndexedDB, not memory).
    const again = await sync.db!.rigs.get(rigId)
    expect(again?.description).toBe('two-6V6 combo, fixed bias')
  })

  it('fitting a new set retires the old one, a spare does not, and an invalid rig is refused with its field', async () => {
    fakeSyncServer().mode = 'down'
    signInPlayer(true)
    const sync = useSyncStore()
    const rigs = useRigsStore()
    await until(() => !!sync.personal && !!sync.engine && rigs.loaded, 'both engines to start')
    const rigId = await rigs.create({ description: 'four-6L6 head', tubes })
    const first = await rigs.fitSet({ rigId, fittedOn: '2025-06-01', tubes })
    await rigs.fitSet({ rigId, fittedOn: '2026-01-05', tubes, spare: true })
    await until(() => rigs.setsOf(rigId).length === 2, 'two sets')
    expect(rigs.setsOf(rigId).find(s => s.id === first)?.retiredOn).toBe('')
    const second = await rigs.fitSet({ rigId, fittedOn: '2026-02-01', tubes })
    await until(() => rigs.setsOf(rigId).find(s => s.id === first)?.retiredOn === '2026-02-01', 'the old set to retire')
    expect(rigs.reminderOf(rigs.byId(rigId)!).set?.id).toBe(second)

    await expect(rigs.create({ description: '', tubes })).rejects.toMatchObject({ fields: { description: 'describe the amp' } })
    // A shop's record still goes to the shop while rigs go to the person's own space.
    await useNotesStore().create({ title: 'Bench', body: 'shop note' })
    expect(await sync.db!.outbox.where('shopId').equals(SHOP_ID).count()).toBe(1)
    expect((await sync.db!.outbox.where('shopId').equals(SPACE).toArray()).every(m => m.name.startsWith('rig'))).toBe(true)
  })
})
