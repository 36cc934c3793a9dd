import { describe, expect, it } from 'vitest'
import { fakeSyncServer, SHOP_ID, signInLocally, until } from './helpers/device'
import { useNotesStore } from '~/stores/notes'
import { useSyncStore } from '~/stores/sync'

const outbox = () => useSyncStore().db!.outbox.where('shopId').equals(SHOP_ID).sortBy('id')

describe('notes store', () => {
  it('creates, searches, edits only what changed, deletes and restores, all offline', async () => {
    const server = fakeSyncServer()
    server.mode = 'down'
    signInLocally()
    const sync = useSyncStore()
    const notes = useNotesStore()
    await until(() => !!sync.engine, 'the engine to start')

    const a = await notes.create({ title: '  100 W four-6L6 head ', body: 'Bias drifts warm after 20 min.' })
    await new Promise(r => setTimeout(r, 5))
    const b = await notes.create({ title: '', body: 'Order 470 kΩ grid resistors.' })
    await until(() => notes.notes.length === 2, 'two notes')
    expect(notes.notes.map(n => n.id)).toEqual([b, a])
    expect(notes.byId(a)?.title).toBe('100 W four-6L6 head')
    expect(notes.search('GRID').map(n => n.id)).toEqual([b])
    expect(notes.search('6l6').map(n => n.id)).toEqual([a])
    expect(notes.search('  ').map(n => n.id)).toEqual([b, a])

    let q = await outbox()
    expect(q.map(m => m.args)).toEqual([
      { id: a, jobId: null, body: 'Bias drifts warm after 20 min.', title: '100 W four-6L6 head' },
      { id: b, jobId: null, body: 'Order 470 kΩ grid resistors.' },
    ])

    // The server's copy arrives (version 7); an edit is based on it and carries only the changed field.
    server.mode = 'up'
    server.version = 7
    const at = new Date().toISOString()
    const authorId = notes.byId(a)!.createdBy
    server.rows.push(
      { table: 'notes', id: b, version: 6, deleted: false, data: { jobId: null, title: '', body: 'Order 470 kΩ grid resistors.', createdBy: authorId, createdAt: at, updatedAt: at } },
      { table: 'notes', id: a, version: 7, deleted: false, data: { jobId: null, title: '100 W four-6L6 head', body: 'Bias drifts warm after 20 min.', createdBy: authorId, createdAt: at, updatedAt: at } },
    )
    sync.syncNow()
    await until(() => notes.byId(a)?.version === 7, 'the server version')
    // The server names the author createdBy; the notebook reads it as the note's author.
    expect(notes.byId(b)?.createdBy).toBe(authorId)
    server.mode = 'down'
    expect(await notes.edit(a, { title: '100 W four-6L6 head', body: 'Bias drifts warm after 20 min. Screen resistors replaced.' })).toBe(true)
    expect(await notes.edit(a, { title: '100 W four-6L6 head', body: 'Bias drifts warm after 20 min. Screen resistors replaced.' })).toBe(false)
    q = await outbox()
    expect(q.at(-1)).toMatchObject({ name: 'note.setFields', args: { id: a, fields: { body: 'Bias drifts warm after 20 min. Screen resistors replaced.' } }, baseVersion: 7 })
    expect(q.at(-1)!.args.fields).not.toHaveProperty('title')
    await until(() => notes.byId(a)?.body.endsWith('replaced.') === true, 'the optimistic edit')

    await notes.remove(a)
    await until(() => notes.notes.length === 1, 'the delete')
    expect((await outbox()).at(-1)).toMatchObject({ name: 'note.delete', args: { id: a }, baseVersion: 7 })
    await notes.restore(a)
    await until(() => notes.notes.length === 2, 'the restore')
    expect((await outbox()).at(-1)).toMatchObject({ name: 'note.restore', args: { id: a }, baseVersion: 7 })
    expect(notes.byId(a)?.body).toBe('Bias drifts warm after 20 min. Screen resistors replaced.')
  })

  it('sends a decision on a conflict, and keeps a deletion by deleting again after resolving', async () => {
    const server = fakeSyncServer()
    const user = signInLocally()
    const sync = useSyncStore()
    const notes = useNotesStore()
    await until(() => !!sync.engine, 'the engine to start')
    const id = crypto.randomUUID()
    const c1 = crypto.randomUUID()
    const c2 = crypto.randomUUID()
    const at = new Date().toISOString()
    const common = { tableName: 'notes', rowId: id, serverAuthor: crypto.randomUUID(), clientAuthor: user.id, serverChangedAt: at, clientChangedAt: at, status: 'open', note: null }
    server.version = 3
    server.rows.push(
      { table: 'notes', id, version: 3, deleted: true, data: { jobId: null, title: '', body: 'Old text', createdBy: user.id, createdAt: at, updatedAt: at } },
      { table: 'conflicts', id: c1, version: 3, deleted: false, data: { ...common, field: 'body', serverValue: null, clientValue: 'Edited while deleted' } },
      { table: 'conflicts', id: c2, version: 3, deleted: false, data: { ...common, field: 'title', serverValue: 'Left', clientValue: 'Right' } },
    )
    sync.syncNow()
    await until(() => sync.conflicts === 2, 'two open conflicts')
    server.mode = 'down'

    await sync.resolveConflict(c2, { value: 'Left and right' })
    await sync.resolveConflict(c1, { value: 'Old text', thenDelete: true })
    const q = (await outbox()).slice(-3)
    expect(q.map(m => [m.name, m.args])).toEqual([
      ['conflict.resolve', { id: c2, value: 'Left and right' }],
      ['conflict.resolve', { id: c1, value: 'Old text' }],
      ['note.delete', { id }],
    ])
    expect(q[2]!.baseVersion).toBe(3)
    await until(() => sync.conflicts === 0, 'both decided on the device')
    expect(notes.byId(id)?.deleted).toBe(true)
    expect(notes.byId(id)?.title).toBe('Left and right')
  })
})
