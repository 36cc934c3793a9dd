import 'fake-indexeddb/auto'
import Dexie from 'dexie'
import { afterEach, describe, expect, it } from 'vitest'
import { LOCAL_DB_SCHEMA, LOCAL_DB_VERSION, LocalDb } from '../../app/utils/sync/local-db'

// Source: Dexie 3.0.0-rc.3 release notes (Dexie.js PR #959): older schema versions need not be
// declared unless they have an upgrade function; Dexie relies on the installed schema and adds what
// the declared one has beyond it. These databases are laid out as earlier releases made them.
const FIRST_RELEASE = {
  meta: 'shopId',
  outbox: '[shopId+id], shopId, uuid, *targets',
  server: '[table+id], shopId',
  notes: 'id, shopId, updatedAt, jobId',
  measurements: 'id, shopId, createdAt, jobId, rigId',
  conflicts: 'id, shopId, rowId, status',
  rejections: '++seq, shopId, uuid',
  blobs: 'sha256, shopId, status',
}
const { rigSuggestions: _added, ...BEFORE_SUGGESTIONS } = LOCAL_DB_SCHEMA

const names: string[] = []
afterEach(async () => {
  for (const n of names.splice(0)) await Dexie.delete(n)
})

async function deviceFrom(release: Record<string, string>, version: number) {
  const name = `upgrade-${names.length}-${Date.now()}`
  names.push(name)
  const old = new Dexie(name)
  old.version(version).stores(release)
  await old.table('outbox').add({ shopId: 's1', id: 1, uuid: 'u1', name: 'note.create', args: { id: 'n1' }, targets: ['notes:n1'], createdAt: '2026-12-01T10:00:00.000Z' })
  await old.table('notes').add({ id: 'n1', shopId: 's1', updatedAt: '2026-12-01T10:00:00.000Z', jobId: null, body: 'kept' })
  old.close()
  return name
}

describe('the on-device database opens a database made by an earlier release', () => {
  for (const [what, release, version] of [['the first release (version 1)', FIRST_RELEASE, 1], ['the release before retube suggestions (version 5)', BEFORE_SUGGESTIONS, 5]] as const) {
    it(`from ${what}: keeps its rows and gains every table and index`, async () => {
      const db = new LocalDb(await deviceFrom(release, version))
      await db.open()
      expect(db.verno).toBe(LOCAL_DB_VERSION)
      expect(db.tables.map(t => t.name).sort()).toEqual(Object.keys(LOCAL_DB_SCHEMA).sort())
      expect(await db.outbox.where('shopId').equals('s1').count()).toBe(1)
      expect((await db.notes.get('n1'))?.body).toBe('kept')
      // New tables and their indexes work.
      await db.jobs.add({ id: 'j1', shopId: 's1', status: 'on-bench', updatedAt: '2026-12-02T09:00:00.000Z' } as never)
      await db.rigSuggestions.add({ id: 'r1', shopId: 's1', rigId: 'rig1' } as never)
      expect(await db.jobs.where('status').equals('on-bench').count()).toBe(1)
      expect(await db.rigSuggestions.where('rigId').equals('rig1').count()).toBe(1)
      db.close()
    })
  }
})
