import { describe, expect, it, vi } from 'vitest'
import { flushPromises } from '@vue/test-utils'
import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { setResponseStatus } from 'h3'
import { fakeSyncServer, signInLocally } from './helpers/device'
import SyncUnsentBanner from '~/components/sync/SyncUnsentBanner.vue'
import SyncNotices from '~/components/sync/SyncNotices.vue'
import { readUnsentHint, useSyncStore } from '~/stores/sync'
import { useNotesStore } from '~/stores/notes'
import { useSessionStore } from '~/stores/session'

async function until(check: () => boolean, what: string) {
  for (let i = 0; i < 300; i++) {
    await flushPromises()
    if (check()) return
    await new Promise(r => setTimeout(r, 10))
  }
  throw new Error(`timed out waiting for ${what}`)
}

describe('sync and the session', () => {
  it('keeps the outbox on a 401, asks to sign in to send it, and sends it after signing in again', async () => {
    const server = fakeSyncServer()
    server.mode = 'down'
    let meStatus = 200
    registerEndpoint('/api/auth/me', (event) => {
      setResponseStatus(event, meStatus)
      return { message: 'Sign in first.' }
    })
    const user = signInLocally()
    const sync = useSyncStore()
    const notes = useNotesStore()
    const session = useSessionStore()
    await until(() => !!sync.engine, 'the engine to start')
    await notes.create({ title: '', body: 'Cathode bypass cap bulging.' })
    await notes.create({ title: '', body: 'Retube with a matched pair.' })
    await until(() => sync.pending === 2, 'two changes waiting')

    // The session ended on the server: sync gets 401, the session check confirms it.
    server.status = 401
    meStatus = 401
    sync.syncNow()
    await until(() => !session.signedIn, 'the sign-out')
    expect(readUnsentHint()).toEqual({ userId: user.id, name: 'Owen Pryde', email: 'tech@larkspur.example', count: 2 })
    const banner = await mountSuspended(SyncUnsentBanner)
    await flushPromises()
    expect(banner.text()).toContain('Sign in to send 2 changes')
    expect(server.pushes).toHaveLength(0)

    // Signing in again as the same person opens the same database and sends both.
    server.mode = 'up'
    signInLocally('tech', user)
    await until(() => server.pushes.length > 0 && sync.pending === 0, 'the changes to go out')
    expect(server.pushes.flatMap(p => p.mutations.map(m => m.args))).toEqual([
      expect.objectContaining({ body: 'Cathode bypass cap bulging.' }),
      expect.objectContaining({ body: 'Retube with a matched pair.' }),
    ])
    expect(readUnsentHint()).toBeNull()
  })

  it('gives another person on the device their own database', async () => {
    fakeSyncServer().mode = 'down'
    signInLocally()
    const sync = useSyncStore()
    const notes = useNotesStore()
    await until(() => !!sync.engine, 'the engine to start')
    const first = sync.db!.name
    await notes.create({ title: '', body: 'Only mine.' })
    await until(() => notes.notes.length === 1, 'the note')
    signInLocally('owner', { id: crypto.randomUUID(), name: 'Mira Castell', email: 'owner@larkspur.example' })
    await until(() => !!sync.db && sync.db.name !== first, 'the other database')
    expect(sync.db!.name).toMatch(/^tubewright-/)
    await until(() => notes.notes.length === 0, 'an empty notebook for the other person')
  })

  it('stops on 426 and asks for an update, keeping every change', async () => {
    const server = fakeSyncServer()
    server.mode = 'down'
    server.status = 426
    signInLocally()
    const sync = useSyncStore()
    const notes = useNotesStore()
    await until(() => !!sync.engine, 'the engine to start')
    await notes.create({ title: '', body: 'Filter caps drained and verified with a meter.' })
    await until(() => sync.pending === 1, 'the change waiting')
    sync.syncNow()
    await until(() => sync.blocked === 'update', 'the update block')
    const notices = await mountSuspended(SyncNotices)
    await flushPromises()
    expect(notices.get('[data-testid="sync-update-banner"]').text()).toContain('Update the app to send your changes')
    expect(sync.pending).toBe(1)
  })

  it('says so when the device is out of space, and saves nothing half-way', async () => {
    fakeSyncServer().mode = 'down'
    signInLocally()
    const sync = useSyncStore()
    const notes = useNotesStore()
    await until(() => !!sync.engine, 'the engine to start')
    const add = vi.spyOn(sync.db!.outbox, 'add').mockRejectedValueOnce(new DOMException('The quota has been exceeded.', 'QuotaExceededError'))
    await expect(notes.create({ title: '', body: 'Will not fit.' })).rejects.toThrow(/out of storage space/)
    add.mockRestore()
    expect(sync.storageFull).toBe(true)
    const notices = await mountSuspended(SyncNotices)
    await flushPromises()
    expect(notices.get('[data-testid="sync-quota-banner"]').text()).toContain('out of storage space')
    // The transaction rolled back: no half-saved note in the view, nothing in the outbox.
    expect(await sync.db!.notes.count()).toBe(0)
    expect(await sync.db!.outbox.count()).toBe(0)
    await notes.create({ title: '', body: 'Fits now.' })
    expect(sync.storageFull).toBe(false)
  })
})
