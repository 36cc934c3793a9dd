import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { DEMO, login } from './helpers/client'
import { device } from './helpers/devices'
import { sql } from './helpers/db'

describe('jobs as synced records', () => {
  it('desk checks a job in offline, the tech moves it along, the timeline is logged, and bad moves are refused', async () => {
    const desk = await device(await login(DEMO.desk), DEMO.shopId)
    const tech = await device(await login(DEMO.tech), DEMO.shopId)
    const customerId = randomUUID()
    const ampId = randomUUID()
    const jobId = randomUUID()
    await desk.engine.mutate('customer.create', { id: customerId, name: 'Test Customer', email: 'test.customer@test.example' })
    await desk.engine.mutate('amp.create', { id: ampId, customerId, description: 'two-6V6 combo, fixed bias', serial: `SN-${jobId.slice(0, 6)}`, biasMode: 'fixed' })
    await desk.engine.mutate('job.create', { id: jobId, customerId, ampId, complaint: 'Hum at idle, one tube glows red' })
    // Shown on the device before any network.
    expect(await desk.db.jobs.get(jobId)).toMatchObject({ status: 'checked-in', priority: 'normal', pending: 1 })
    const pushed = await desk.engine.push()
    expect(pushed.results.map(r => r.status)).toEqual(['applied', 'applied', 'applied'])

    await tech.engine.pull()
    const seen = await tech.db.jobs.get(jobId)
    expect(seen).toMatchObject({ status: 'checked-in', complaint: 'Hum at idle, one tube glows red' })
    await tech.engine.mutate('job.setFields', { id: jobId, fields: { status: 'on-bench' } }, seen!.version)
    await tech.engine.mutate('jobPart.create', { id: randomUUID(), jobId, description: 'Matched pair 6V6GT', quantity: 1, unitPriceCents: 6400 })
    await tech.engine.mutate('job.setFields', { id: jobId, fields: { status: 'closed' } }, seen!.version)
    const r = await tech.engine.push()
    expect(r.results.map(x => x.status)).toEqual(['applied', 'applied', 'rejected'])
    expect(r.results[2]!.reason).toMatch(/cannot go from On the bench to Closed/)

    const events = await sql<{ from_status: string | null, to_status: string }>('select from_status, to_status from job_events where job_id = ? order by version', [jobId])
    expect(events).toEqual([{ from_status: null, to_status: 'checked-in' }, { from_status: 'checked-in', to_status: 'on-bench' }])
    await tech.engine.pull()
    expect(await tech.db.jobEvents.where('jobId').equals(jobId).count()).toBe(2)
    expect((await tech.db.jobs.get(jobId))!.status).toBe('on-bench')
  })

  it('refuses a tech creating a customer, a job pointing at another shop, and a player editing', async () => {
    const tech = await device(await login(DEMO.tech), DEMO.shopId)
    await tech.engine.mutate('customer.create', { id: randomUUID(), name: 'Nope' })
    await tech.engine.mutate('amp.create', { id: randomUUID(), customerId: randomUUID(), description: 'orphan amp' })
    const r = await tech.engine.push()
    expect(r.results.map(x => x.status)).toEqual(['rejected', 'rejected'])
    expect(r.results[0]!.reason).toMatch(/may not create customers/)
    expect(r.results[1]!.reason).toMatch(/customer not found/)
    expect(await tech.db.rejections.count()).toBe(2)
  })

  it('shows a player only the jobs of the customer record linked to them', async () => {
    const desk = await device(await login(DEMO.desk), DEMO.shopId)
    const sam = await login(DEMO.sam)
    const samId = (await sam.get('/api/auth/me')).body.user.id
    const mineCustomer = randomUUID()
    const otherCustomer = randomUUID()
    const mineJob = randomUUID()
    const otherJob = randomUUID()
    for (const [cid, jid, pid] of [[mineCustomer, mineJob, samId], [otherCustomer, otherJob, null]] as const) {
      const ampId = randomUUID()
      await desk.engine.mutate('customer.create', { id: cid, name: pid ? 'Sam (linked)' : 'Somebody else', playerUserId: pid })
      await desk.engine.mutate('amp.create', { id: ampId, customerId: cid, description: '18 W two-EL84 combo, cathode biased', biasMode: 'cathode' })
      await desk.engine.mutate('job.create', { id: jid, customerId: cid, ampId, complaint: 'Crackles when warm' })
    }
    expect((await desk.engine.push()).results.every(x => x.status === 'applied')).toBe(true)
    const player = await device(sam, DEMO.shopId)
    await player.engine.pull()
    expect(await player.db.jobs.get(mineJob)).toBeDefined()
    expect(await player.db.jobs.get(otherJob)).toBeUndefined()
    expect(await player.db.customers.get(otherCustomer)).toBeUndefined()
    await player.engine.mutate('job.setFields', { id: mineJob, fields: { complaint: 'changed by the player' } }, (await player.db.jobs.get(mineJob))!.version)
    const r = await player.engine.push()
    expect(r.results[0]!.status).toBe('rejected')
  })
})
