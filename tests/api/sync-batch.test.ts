import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { SYNC_SCHEMA_VERSION } from '../../shared/utils/sync/protocol'
import { DEMO, newOwner, type Client } from './helpers/client'
import { sql } from './helpers/db'

interface M { id: number, uuid: string, name: string, args: Record<string, unknown>, baseVersion?: number }
const push = (c: Client, shopId: string, clientId: string, mutations: M[]) =>
  c.post('/api/sync/push', { clientId, shopId, schemaVersion: SYNC_SCHEMA_VERSION, mutations })
const m = (id: number, name: string, args: Record<string, unknown>): M => ({ id, uuid: randomUUID(), name, args })
const shopVersion = async (shopId: string) => Number((await sql('select version from shop_versions where shop_id = ?', [shopId]))[0].version)
const lmidOf = async (clientId: string) => Number((await sql('select lmid from sync_clients where id = ?', [clientId]))[0].lmid)
const versionOf = async (table: string, id: string) => (await sql(`select version from ${table} where id = ?`, [id])).map(r => Number(r.version))

describe('a push of many mutations in one batch', () => {
  it('applies, rejects and skips each mutation as it would alone, and refuses a reused uuid before writing anything', async () => {
    const { c, shopId } = await newOwner('batch')
    const clientId = randomUUID()
    const [otherShopJob] = await sql<{ id: string }>('select id from jobs where shop_id = ? limit 1', [DEMO.shopId])
    const first = m(1, 'note.create', { id: randomUUID(), jobId: null, body: 'first push' })
    expect((await push(c, shopId, clientId, [first])).body.results).toEqual([{ id: 1, status: 'applied' }])
    const v0 = await shopVersion(shopId)

    const customer = randomUUID()
    const amp = randomUUID()
    const job = randomUUID()
    const onJob = randomUUID()
    const loose = randomUUID()
    const refused = randomUUID()
    const batch: M[] = [
      first,
      m(2, 'customer.create', { id: customer, name: 'Batch customer' }),
      m(3, 'amp.create', { id: amp, customerId: customer, description: 'Head, four EL34' }),
      m(4, 'job.create', { id: job, customerId: customer, ampId: amp, complaint: 'Crackles when warm' }),
      m(5, 'note.create', { id: onJob, jobId: job, body: 'on the new job' }),
      m(6, 'note.create', { id: refused, jobId: otherShopJob!.id, body: 'on a job of another shop' }),
      m(7, 'note.create', { id: randomUUID(), jobId: randomUUID(), body: 'on no job at all' }),
      m(8, 'note.create', { id: loose, jobId: null, body: 'loose' }),
      m(9, 'note.create', { id: loose, jobId: null, body: 'same id again' }),
      m(10, 'note.create', { id: first.args.id as string, jobId: null, body: 'id of the first push' }),
      { ...m(11, 'note.setFields', { id: loose, fields: { body: 'loose, edited' } }), baseVersion: v0 },
    ]
    // Mutation 6 again (same number, same change), as a device may send after a lost reply.
    const repeated = batch[5]!

    const reusedUuid = { ...m(12, 'note.create', { id: randomUUID(), jobId: null, body: 'reuses a uuid' }), uuid: first.uuid }
    const refusedPush = await push(c, shopId, clientId, [...batch, reusedUuid])
    expect(refusedPush.status).toBe(422)
    expect(refusedPush.body.message).toBe(`Mutation ${first.uuid} was already applied under another number.`)
    const inBatchUuid = { ...m(12, 'note.create', { id: randomUUID(), jobId: null, body: 'reuses a uuid of this push' }), uuid: batch[7]!.uuid }
    const refusedAgain = await push(c, shopId, clientId, [...batch, inBatchUuid])
    expect(refusedAgain.status).toBe(422)
    expect(refusedAgain.body.message).toBe(`Mutation ${batch[7]!.uuid} was already applied under another number.`)
    expect(await shopVersion(shopId)).toBe(v0)
    expect(await lmidOf(clientId)).toBe(1)
    expect(await sql('select id from customers where id = ?', [customer])).toHaveLength(0)
    expect(await sql('select mutation_id from sync_mutations where client_id = ?', [clientId])).toHaveLength(1)

    const r = await push(c, shopId, clientId, [...batch, repeated])
    expect(r.status, JSON.stringify(r.body)).toBe(200)
    expect(r.body.lmid).toBe(11)
    const notFound = 'job not found in this shop'
    const taken = 'a record with this id already exists'
    expect(r.body.results).toEqual([
      { id: 1, status: 'duplicate', was: 'applied' },
      { id: 2, status: 'applied' },
      { id: 3, status: 'applied' },
      { id: 4, status: 'applied' },
      { id: 5, status: 'applied' },
      { id: 6, status: 'rejected', reason: notFound },
      { id: 6, status: 'duplicate', was: 'rejected', reason: notFound },
      { id: 7, status: 'rejected', reason: notFound },
      { id: 8, status: 'applied' },
      { id: 9, status: 'rejected', reason: taken },
      { id: 10, status: 'rejected', reason: taken },
      { id: 11, status: 'applied' },
    ])

    // Each applied mutation took the next version; a rejected one took none.
    expect(await shopVersion(shopId)).toBe(v0 + 6)
    expect(await versionOf('customers', customer)).toEqual([v0 + 1])
    expect(await versionOf('amps', amp)).toEqual([v0 + 2])
    expect(await versionOf('jobs', job)).toEqual([v0 + 3])
    const events = await sql('select to_status, version from job_events where job_id = ?', [job])
    expect(events.map(e => [e.to_status, Number(e.version)])).toEqual([['checked-in', v0 + 3]])
    expect(await versionOf('notes', onJob)).toEqual([v0 + 4])
    expect(await sql('select body from notes where id = ?', [loose])).toEqual([{ body: 'loose, edited' }])
    expect(await versionOf('notes', loose)).toEqual([v0 + 6])
    expect((await sql('select body from notes where id = ?', [first.args.id]))[0].body).toBe('first push')
    expect(await sql('select id from notes where id = ?', [refused])).toHaveLength(0)

    const logged = await sql('select mutation_id, uuid, status, reason, version from sync_mutations where client_id = ? order by mutation_id', [clientId])
    expect(logged.map(l => [Number(l.mutation_id), l.status, l.version === null ? null : Number(l.version)])).toEqual([
      [1, 'applied', v0], [2, 'applied', v0 + 1], [3, 'applied', v0 + 2], [4, 'applied', v0 + 3], [5, 'applied', v0 + 4],
      [6, 'rejected', null], [7, 'rejected', null], [8, 'applied', v0 + 5], [9, 'rejected', null], [10, 'rejected', null], [11, 'applied', v0 + 6],
    ])
    expect(logged[5]).toMatchObject({ uuid: repeated.uuid, reason: notFound })
    expect(await lmidOf(clientId)).toBe(11)

    // The whole batch again: every mutation answers as it was logged, and nothing moves.
    const again = await push(c, shopId, clientId, batch)
    expect(again.body.results.map((x: { status: string, was: string }) => `${x.status} ${x.was}`)).toEqual([
      'applied', 'applied', 'applied', 'applied', 'applied', 'rejected', 'rejected', 'applied', 'rejected', 'rejected', 'applied',
    ].map(was => `duplicate ${was}`))
    expect(await shopVersion(shopId)).toBe(v0 + 6)
  })

  it('answers 422 for a number sent twice in one push with different changes, and writes nothing', async () => {
    const { c, shopId } = await newOwner('batch-twice')
    const clientId = randomUUID()
    const r = await push(c, shopId, clientId, [
      m(1, 'note.create', { id: randomUUID(), jobId: null, body: 'one' }),
      m(1, 'note.create', { id: randomUUID(), jobId: null, body: 'another' }),
    ])
    expect(r.status).toBe(422)
    expect(r.body.message).toBe('Mutation 1 was already used for a different change.')
    expect(await sql('select id from notes where shop_id = ?', [shopId])).toHaveLength(0)
    expect(await sql('select mutation_id from sync_mutations where client_id = ?', [clientId])).toHaveLength(0)
  })

  it('stores the text of creates inserted together exactly as sent, quotes, placeholders and all', async () => {
    const { c, shopId } = await newOwner('batch-text')
    const clientId = randomUUID()
    const bodies = [
      `O'Brien's "combo" \\ 2 × 6L6, C:\\amps\\ ?? ?`,
      'line one\nline two\ttabbed -- not a comment; drop table notes;',
      'émigré 真空管 🎸 \u0000 end',
      '',
    ]
    const ids = bodies.map(() => randomUUID())
    const r = await push(c, shopId, clientId, bodies.map((body, i) => m(i + 1, 'note.create', { id: ids[i], jobId: null, title: `T${i}?`, body })))
    expect(r.status).toBe(200)
    expect(r.body.results.map((x: { status: string }) => x.status)).toEqual(bodies.map(() => 'applied'))
    const pulled = await c.post('/api/sync/pull', { clientId, shopId, schemaVersion: SYNC_SCHEMA_VERSION, cookie: null })
    const notes = new Map(pulled.body.changes.filter((ch: { table: string }) => ch.table === 'notes').map((ch: { id: string, data: { body: string, title: string } }) => [ch.id, ch.data]))
    ids.forEach((id, i) => expect(notes.get(id)).toMatchObject({ body: bodies[i], title: `T${i}?` }))
    const stamps = await sql('select field_stamps, created_at from notes where id = ?', [ids[0]])
    expect(Object.keys(typeof stamps[0].field_stamps === 'string' ? JSON.parse(stamps[0].field_stamps) : stamps[0].field_stamps)).toContain('body')
    expect(Math.abs(new Date(stamps[0].created_at).getTime() - Date.now())).toBeLessThan(5 * 60_000)
  })
})
