import { describe, expect, it } from 'vitest'
import { describeChange, itemSyncState, SYNC_STATE_WORDS, syncStateOf, whenText } from '../../app/utils/sync/status'
import { conflictView } from '../../app/utils/sync/conflict-view'
import type { ConflictRow, NoteRow } from '../../app/utils/sync/local-db'
import { backoffDelay } from '../../app/utils/sync/backoff'

describe('sync state shown to the person', () => {
  const base = { pending: 0, conflicts: 0, sending: false, lastSyncedAt: '2026-12-01T10:00:00.000Z' }
  it('uses exactly the four product words', () => {
    expect(Object.values(SYNC_STATE_WORDS)).toEqual(['on this device', 'sending', 'synced', 'needs a decision'])
  })
  it('ranks a decision first, then sending, then waiting, then synced', () => {
    expect(syncStateOf({ ...base, conflicts: 1, pending: 3, sending: true })).toBe('conflict')
    expect(syncStateOf({ ...base, pending: 3, sending: true })).toBe('sending')
    expect(syncStateOf({ ...base, pending: 3 })).toBe('local')
    expect(syncStateOf(base)).toBe('synced')
  })
  it('never says synced before the server has answered once, nor sending with nothing to send', () => {
    expect(syncStateOf({ ...base, lastSyncedAt: null })).toBe('local')
    expect(syncStateOf({ ...base, sending: true })).toBe('synced')
  })
  it('gives each record its own state', () => {
    const conflicted = new Set(['n1'])
    expect(itemSyncState({ id: 'n1', version: 4, pending: 0 }, conflicted)).toBe('conflict')
    expect(itemSyncState({ id: 'n2', version: 0, pending: 1 }, conflicted)).toBe('local')
    expect(itemSyncState({ id: 'n2', version: 4, pending: 1 }, conflicted)).toBe('local')
    expect(itemSyncState({ id: 'n2', version: 4, pending: 0 }, conflicted)).toBe('synced')
  })
})

describe('describing changes and times', () => {
  it('names a change with the start of its text', () => {
    expect(describeChange('note.create', { id: 'x', jobId: null, body: 'Hum at idle' })).toBe('New note: Hum at idle')
    expect(describeChange('note.setFields', { id: 'x', fields: { title: 'Two-6V6 combo' } })).toBe('Note edited: Two-6V6 combo')
    expect(describeChange('measurement.delete', { id: 'x' })).toBe('Bench result deleted')
    expect(describeChange('note.create', { id: 'x', jobId: null, body: 'a'.repeat(60) })).toBe(`New note: ${'a'.repeat(39)}…`)
  })
  it('says how long ago', () => {
    const now = new Date('2026-12-01T12:00:00.000Z')
    expect(whenText(null, now)).toBe('never')
    expect(whenText('2026-12-01T11:59:30.000Z', now)).toBe('just now')
    expect(whenText('2026-12-01T11:55:00.000Z', now)).toBe('5 min ago')
    expect(whenText('2026-12-01T09:00:00.000Z', now)).toBe('3 h ago')
  })
})

describe('backoff', () => {
  it('doubles from 2 s up to 5 min, jittered into the upper half', () => {
    expect(backoffDelay(1, () => 0)).toBe(1000)
    expect(backoffDelay(1, () => 1)).toBe(2000)
    expect(backoffDelay(3, () => 1)).toBe(8000)
    expect(backoffDelay(30, () => 1)).toBe(300_000)
    expect(backoffDelay(30, () => 0)).toBe(150_000)
  })
})

describe('conflict view', () => {
  const c = (over: Partial<ConflictRow>): ConflictRow => ({
    id: 'c', shopId: 's', version: 3, deleted: false, pending: 0, tableName: 'notes', rowId: 'n', field: 'body',
    serverValue: 'first', clientValue: 'second', serverAuthor: 'u1', clientAuthor: 'u2', serverChangedAt: null, clientChangedAt: '2026-12-01T10:00:00.000Z',
    status: 'open', note: null, ...over,
  })
  it('offers both texts and a merge seeded with both', () => {
    const v = conflictView(c({}))
    expect(v.sides.map(s => s.choice.value)).toEqual(['first', 'second'])
    expect(v.sides.map(s => s.authorId)).toEqual(['u1', 'u2'])
    expect(v.mergeable).toBe(true)
    expect(v.mergeSeed).toBe('first\n\nsecond')
  })
  it('turns edit-versus-delete into keep (false) or delete (true), with no merge', () => {
    const v = conflictView(c({ field: '_delete', serverValue: { title: 'T', body: 'B' }, clientValue: true }))
    expect(v.sides.map(s => s.choice)).toEqual([{ value: false }, { value: true }])
    expect(v.sides[0]!.text).toBe('T\n\nB')
    expect(v.mergeable).toBe(false)
  })
  it('keeps a deletion by resolving with the stored text and deleting again', () => {
    const note = { body: 'stored text', title: '' } as NoteRow
    const v = conflictView(c({ serverValue: null, clientValue: 'edited after', note: 'edited after it was deleted' }), { record: note as unknown as Record<string, unknown> })
    expect(v.sides[0]!.choice).toEqual({ value: 'stored text', thenDelete: true })
    expect(v.sides[1]!.choice).toEqual({ value: 'edited after' })
  })
})
