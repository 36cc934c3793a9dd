import { describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { fakeSyncServer, SHOP_ID, signInLocally, until } from './helpers/device'
import AppSyncChip from '~/components/app/AppSyncChip.vue'
import { useSyncStore } from '~/stores/sync'
import { useNotesStore } from '~/stores/notes'

describe('AppSyncChip over the real sync store', () => {
  it('walks through on this device, sending, synced and needs a decision with the right words and shapes', async () => {
    const server = fakeSyncServer()
    server.mode = 'down'
    const user = signInLocally()
    const sync = useSyncStore()
    const notes = useNotesStore()
    const chip = await mountSuspended(AppSyncChip)
    const state = () => chip.find('[data-testid="sync-chip"]')
    await until(() => !!sync.engine, 'the engine to start')

    // Written while the server is down: kept on this device, with the count.
    const id = await notes.create({ title: 'Two-6V6 combo', body: 'Hum at idle, check the filter caps.' })
    // A push may be on its way (and failing) for a moment; the chip settles on this device.
    await until(() => sync.pending === 1 && state().attributes('data-state') === 'local', 'the outbox to hold the note')
    expect(state().text()).toContain('on this device')
    expect(state().text()).toContain('1')
    expect(state().attributes('data-state')).toBe('local')
    expect(state().find('svg').attributes('data-shape')).toBe('local')

    // The server comes back but holds the push open: the chip says sending.
    server.mode = 'hold'
    sync.syncNow()
    await until(() => state().attributes('data-state') === 'sending', 'sending')
    expect(state().text()).toContain('sending')
    expect(state().find('svg').attributes('data-shape')).toBe('sending')

    // The push is applied and the pull brings the note back as the server's row.
    server.version = 1
    server.rows.push({ table: 'notes', id, version: 1, deleted: false, data: { jobId: null, title: 'Two-6V6 combo', body: 'Hum at idle, check the filter caps.', createdBy: user.id, createdAt: new Date().toISOString(), updatedAt: new Date().toISOString() } })
    server.mode = 'up'
    server.release()
    await until(() => state().attributes('data-state') === 'synced', 'synced')
    expect(state().text()).toContain('synced')
    expect(state().text()).not.toMatch(/\d/)
    expect(sync.pending).toBe(0)
    expect(server.pushes.flatMap(p => p.mutations.map(m => m.name))).toEqual(['note.create'])
    await until(() => notes.byId(id)?.version === 1, 'the server copy of the note')

    // Someone else's edit clashed on the server: the pull brings an open conflict.
    server.version = 2
    server.rows.push({
      table: 'conflicts', id: crypto.randomUUID(), version: 2, deleted: false,
      data: { tableName: 'notes', rowId: id, field: 'body', serverValue: 'Hum gone after new caps.', clientValue: 'Hum at idle, check the filter caps.', serverAuthor: crypto.randomUUID(), clientAuthor: user.id, serverChangedAt: new Date().toISOString(), clientChangedAt: new Date().toISOString(), status: 'open', note: null },
    })
    sync.syncNow()
    await until(() => state().attributes('data-state') === 'conflict', 'needs a decision')
    expect(state().text()).toContain('needs a decision')
    expect(state().find('svg').attributes('data-shape')).toBe('conflict')
    expect(state().attributes('href')).toBe('/sync')
    expect(sync.conflictRowIds.has(id)).toBe(true)
    expect(sync.shopId).toBe(SHOP_ID)

    // The connection drops with the decision still open: the chip says offline and counts what waits.
    server.mode = 'down'
    await notes.create({ title: 'Backstage', body: 'Spare pair checked.' })
    await until(() => sync.pending === 1, 'the new note waiting')
    sync.offline = true
    await until(() => state().find('[data-testid="sync-chip-offline"]').exists(), 'offline')
    expect(state().text()).toContain('needs a decision')
    expect(state().text()).toContain('1')
    expect(state().attributes('data-state')).toBe('conflict')
    expect(state().attributes('aria-label')).toBe('Sync: needs a decision 1 offline; 1 change waiting, 1 to decide')
  })
})
