import { describe, expect, it } from 'vitest'
import { device } from './helpers/devices'
import { DEMO, login } from './helpers/client'

describe('a device between push and pull', () => {
  it('keeps showing a sent change after a restart, until a pull brings the server copy', async () => {
    const tech = await login(DEMO.tech)
    const d = await device(tech, DEMO.shopId)
    await d.engine.pull()
    const id = crypto.randomUUID()
    await d.engine.mutate('note.create', { id, jobId: null, body: 'Sent just as the signal went.' })
    const { results } = await d.engine.push()
    expect(results).toEqual([expect.objectContaining({ status: 'applied' })])
    expect(await d.engine.pendingCount()).toBe(0)

    // The tab is killed before its pull; the new one rebuilds the view from what is on the device.
    await d.restart()
    const shown = await d.db.notes.get(id)
    expect(shown?.body).toBe('Sent just as the signal went.')
    expect(shown?.deleted).toBe(false)
    expect(await d.engine.pendingCount()).toBe(0)

    // The pull brings the server's row; the answered change leaves the outbox.
    await d.engine.pull()
    expect(await d.db.outbox.count()).toBe(0)
    const synced = await d.db.notes.get(id)
    expect(synced?.version).toBeGreaterThan(0)
    expect(synced?.pending).toBe(0)
    expect(synced?.body).toBe('Sent just as the signal went.')
  })

  it('keeps an edit visible when the pull after its push fails, and does not send it twice', async () => {
    const tech = await login(DEMO.tech)
    const d = await device(tech, DEMO.shopId)
    const id = crypto.randomUUID()
    await d.engine.mutate('note.create', { id, jobId: null, body: 'First text' })
    await d.engine.sync()
    const row = (await d.db.notes.get(id))!
    await d.engine.mutate('note.setFields', { id, fields: { body: 'Second text' } }, row.version)
    await d.engine.push()
    d.transport.faults = { dropRequest: 1, dropResponse: 0, duplicate: 0 }
    await expect(d.engine.pull()).rejects.toThrow(/network/)
    await d.restart()
    expect((await d.db.notes.get(id))?.body).toBe('Second text')
    d.transport.faults = { dropRequest: 0, dropResponse: 0, duplicate: 0 }
    const again = await d.engine.sync()
    expect(again.pushed.sent).toBe(0)
    expect((await d.db.notes.get(id))?.body).toBe('Second text')
    expect(await d.db.outbox.count()).toBe(0)
  })
})
