import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { device, shopWithMembers } from './helpers/devices'
import { sql } from './helpers/db'

describe('conflicts', () => {
  it('500 concurrent same-field pairs make 500 conflicts and no silent overwrite; different fields merge', async () => {
    const { shopId, members } = await shopWithMembers(1)
    const a = await device(members[0]!, shopId)
    const b = await device(members[1]!, shopId)
    const ids = Array.from({ length: 500 }, () => randomUUID())
    const mergeIds = Array.from({ length: 50 }, () => randomUUID())
    for (const id of [...ids, ...mergeIds]) await a.engine.mutate('note.create', { id, jobId: null, body: 'original', title: 'original' })
    await a.engine.sync()
    await b.engine.pull()
    for (const id of ids) {
      const base = (await a.db.notes.get(id))!.version
      await a.engine.mutate('note.setFields', { id, fields: { body: `from A ${id}` } }, base)
      await b.engine.mutate('note.setFields', { id, fields: { body: `from B ${id}` } }, base)
    }
    for (const id of mergeIds) {
      const base = (await a.db.notes.get(id))!.version
      await a.engine.mutate('note.setFields', { id, fields: { title: 'title from A' } }, base)
      await b.engine.mutate('note.setFields', { id, fields: { body: 'body from B' } }, base)
    }
    const [pa, pb] = await Promise.all([a.engine.push(), b.engine.push()])
    const statuses = [...pa.results, ...pb.results].map(r => r.status)
    expect(statuses.filter(s => s === 'conflict')).toHaveLength(500)

    const conflicts = await sql<{ row_id: string, server_value: string, client_value: string, status: string }>(
      'select row_id, server_value, client_value, status from sync_conflicts where shop_id = ?', [shopId])
    expect(conflicts).toHaveLength(500)
    const notes = new Map((await sql<{ id: string, body: string, title: string }>('select id, body, title from notes where shop_id = ?', [shopId])).map(n => [n.id, n]))
    for (const c of conflicts) {
      // The server kept one value and the conflict holds the other: nothing was lost.
      const kept = notes.get(c.row_id)!.body
      const values = new Set([JSON.parse(JSON.stringify(c.server_value)), JSON.parse(JSON.stringify(c.client_value))].map(v => (typeof v === 'string' && v.startsWith('"') ? JSON.parse(v) : v)))
      expect(values).toEqual(new Set([`from A ${c.row_id}`, `from B ${c.row_id}`]))
      expect(values.has(kept)).toBe(true)
      expect(c.status).toBe('open')
    }
    for (const id of mergeIds) {
      expect(notes.get(id)).toMatchObject({ title: 'title from A', body: 'body from B' })
    }
    // Both devices see the open conflicts ("needs a decision").
    await a.engine.pull()
    await b.engine.pull()
    expect(await a.db.conflicts.where('status').equals('open').count()).toBe(500)
    expect(await b.db.conflicts.where('status').equals('open').count()).toBe(500)
  }, 120_000)

  it('a person resolves a conflict with a merged value, and every device converges on it', async () => {
    const { shopId, members } = await shopWithMembers(1)
    const a = await device(members[0]!, shopId)
    const b = await device(members[1]!, shopId)
    const id = randomUUID()
    await a.engine.mutate('note.create', { id, jobId: null, body: 'start' })
    await a.engine.sync()
    await b.engine.pull()
    const v = (await b.db.notes.get(id))!.version
    await a.engine.mutate('note.setFields', { id, fields: { body: 'A says 38 mA' } }, v)
    await b.engine.mutate('note.setFields', { id, fields: { body: 'B says 36 mA' } }, v)
    await a.engine.sync()
    await b.engine.sync()
    await a.engine.pull()
    const [conflict] = await b.db.conflicts.where('rowId').equals(id).toArray()
    expect(conflict).toMatchObject({ status: 'open', field: 'body', serverValue: 'A says 38 mA', clientValue: 'B says 36 mA' })
    await b.engine.mutate('conflict.resolve', { id: conflict!.id, value: 'A 38 mA, B 36 mA: re-measure' })
    // The device shows the decision at once, before it reaches the server.
    expect((await b.db.notes.get(id))!.body).toBe('A 38 mA, B 36 mA: re-measure')
    await b.engine.sync()
    await a.engine.pull()
    expect((await a.db.notes.get(id))!.body).toBe('A 38 mA, B 36 mA: re-measure')
    expect((await a.db.conflicts.get(conflict!.id))!.status).toBe('resolved')
  })

  it('a delete of a note edited since, and an edit of a deleted note, are conflicts', async () => {
    const { shopId, members } = await shopWithMembers(1)
    const a = await device(members[0]!, shopId)
    const b = await device(members[1]!, shopId)
    const edited = randomUUID()
    const deleted = randomUUID()
    await a.engine.mutate('note.create', { id: edited, jobId: null, body: 'keep me' })
    await a.engine.mutate('note.create', { id: deleted, jobId: null, body: 'bin me' })
    await a.engine.sync()
    await b.engine.pull()
    const ve = (await b.db.notes.get(edited))!.version
    const vd = (await b.db.notes.get(deleted))!.version
    await a.engine.mutate('note.setFields', { id: edited, fields: { body: 'edited by A' } }, ve)
    await a.engine.mutate('note.delete', { id: deleted }, vd)
    await a.engine.sync()
    await b.engine.mutate('note.delete', { id: edited }, ve)
    await b.engine.mutate('note.setFields', { id: deleted, fields: { body: 'edited by B' } }, vd)
    const r = await b.engine.push()
    expect(r.results.map(x => x.status)).toEqual(['conflict', 'conflict'])
    const [row] = await sql<{ deleted_at: Date | null, body: string }>('select deleted_at, body from notes where id = ?', [edited])
    expect(row).toMatchObject({ deleted_at: null, body: 'edited by A' })
    const kept = await sql<{ field: string, client_value: unknown }>('select field, client_value from sync_conflicts where row_id in (?, ?) order by field', [edited, deleted])
    expect(kept.map(k => k.field)).toEqual(['_delete', 'body'])
  })

  it('gives the same result when device clocks are 24 h off', async () => {
    const run = async (skewMs: number) => {
      const { shopId, members } = await shopWithMembers(1)
      const skewed = () => new Date(Date.now() + skewMs)
      const a = await device(members[0]!, shopId, { now: skewed })
      const b = await device(members[1]!, shopId, { now: () => new Date(Date.now() - skewMs) })
      const id = randomUUID()
      await a.engine.mutate('note.create', { id, jobId: null, body: 'v0' })
      await a.engine.sync()
      await b.engine.pull()
      const v = (await b.db.notes.get(id))!.version
      // B edits first on the wall clock of its own, A reaches the server first.
      await b.engine.mutate('note.setFields', { id, fields: { body: 'from B' } }, v)
      await a.engine.mutate('note.setFields', { id, fields: { body: 'from A' } }, v)
      await a.engine.push()
      await b.engine.push()
      await a.engine.pull()
      await b.engine.pull()
      const [n] = await sql<{ body: string }>('select body from notes where id = ?', [id])
      const [c] = await sql<{ client_value: unknown }>('select client_value from sync_conflicts where row_id = ?', [id])
      return { server: n!.body, losing: c!.client_value, a: (await a.db.notes.get(id))!.body, b: (await b.db.notes.get(id))!.body }
    }
    const straight = await run(0)
    const skewed = await run(24 * 3600_000)
    expect(skewed).toEqual(straight)
    expect(straight).toEqual({ server: 'from A', losing: 'from B', a: 'from A', b: 'from A' })
  })
})
