import { randomUUID } from 'node:crypto'
import { describe, expect, it } from 'vitest'
import { conflictView } from '../../app/utils/sync/conflict-view'
import { DEMO, login } from './helpers/client'
import { device, type Device } from './helpers/devices'
import { sql } from './helpers/db'

async function jobOnTheBench(desk: Device) {
  const customerId = randomUUID()
  const ampId = randomUUID()
  const jobId = randomUUID()
  await desk.engine.mutate('customer.create', { id: customerId, name: 'Conflict Customer' })
  await desk.engine.mutate('amp.create', { id: ampId, customerId, description: 'two-6L6 combo', biasMode: 'fixed' })
  await desk.engine.mutate('job.create', { id: jobId, customerId, ampId, complaint: 'Drifts after an hour' })
  await desk.engine.mutate('job.setFields', { id: jobId, fields: { status: 'on-bench' } })
  await desk.engine.sync()
  return jobId
}

/** Resolve the device's open conflict on a row with the side the screen offers under that key. */
async function decide(d: Device, rowId: string, key: 'server' | 'client') {
  const [c] = await d.db.conflicts.where('rowId').equals(rowId).filter(x => x.status === 'open').toArray()
  expect(c).toBeDefined()
  const view = conflictView(c!, { record: await d.db.table(c!.tableName).get(rowId) })
  const choice = view.sides.find(s => s.key === key)!.choice
  await d.engine.mutate('conflict.resolve', { id: c!.id, value: choice.value })
  const r = await d.engine.push()
  expect(r.results.map(x => [x.status, x.reason])).toEqual([['applied', undefined]])
  return { c: c!, view }
}

describe('conflicts on jobs and their lines', () => {
  it('a job moved two ways from Soak is a conflict the tech decides, and the chosen state is applied', async () => {
    const desk = await device(await login(DEMO.desk), DEMO.shopId)
    const tech = await device(await login(DEMO.tech), DEMO.shopId)
    const jobId = await jobOnTheBench(desk)
    await tech.engine.pull()
    await tech.engine.mutate('job.setFields', { id: jobId, fields: { status: 'soak' } }, (await tech.db.jobs.get(jobId))!.version)
    await tech.engine.sync()
    await desk.engine.pull()
    // The tech goes offline and moves it back to the bench; the desk marks it ready.
    const base = (await tech.db.jobs.get(jobId))!.version
    await tech.engine.mutate('job.setFields', { id: jobId, fields: { status: 'on-bench' } }, base)
    await desk.engine.mutate('job.setFields', { id: jobId, fields: { status: 'ready' } }, (await desk.db.jobs.get(jobId))!.version)
    expect((await desk.engine.push()).results[0]!.status).toBe('applied')
    expect((await tech.engine.push()).results[0]!.status).toBe('conflict')
    await tech.engine.pull()

    const { view } = await decide(tech, jobId, 'client')
    expect(view.title).toBe('Job · status')
    expect(view.sides.map(s => s.text)).toEqual(['Ready', 'On the bench'])
    expect(view.mergeable).toBe(false)
    const [row] = await sql<{ status: string }>('select status from jobs where id = ?', [jobId])
    expect(row!.status).toBe('on-bench')
    const events = await sql<{ from_status: string, to_status: string }>('select from_status, to_status from job_events where job_id = ? order by version', [jobId])
    expect(events.slice(-2)).toEqual([{ from_status: 'soak', to_status: 'ready' }, { from_status: 'ready', to_status: 'on-bench' }])
    await desk.engine.pull()
    expect((await desk.db.jobs.get(jobId))!.status).toBe('on-bench')
    expect(await desk.db.conflicts.where('rowId').equals(jobId).filter(c => c.status === 'open').count()).toBe(0)
  })

  it('a part priced twice is a conflict decided by picking a price, and the price is applied', async () => {
    const desk = await device(await login(DEMO.desk), DEMO.shopId)
    const owner = await device(await login(DEMO.owner), DEMO.shopId)
    const tech = await device(await login(DEMO.tech), DEMO.shopId)
    const jobId = await jobOnTheBench(desk)
    await tech.engine.pull()
    const partId = randomUUID()
    await tech.engine.mutate('jobPart.create', { id: partId, jobId, description: 'Output transformer', quantity: 1, unitPriceCents: 8950 })
    await tech.engine.sync()
    await owner.engine.pull()
    const base = (await tech.db.jobParts.get(partId))!.version
    await owner.engine.mutate('jobPart.setFields', { id: partId, fields: { unitPriceCents: 9400 } }, base)
    await tech.engine.mutate('jobPart.setFields', { id: partId, fields: { unitPriceCents: 9900 } }, base)
    expect((await owner.engine.push()).results[0]!.status).toBe('applied')
    expect((await tech.engine.push()).results[0]!.status).toBe('conflict')
    await owner.engine.pull()

    const { view } = await decide(owner, partId, 'client')
    expect(view.title).toBe('Part \'Output transformer\' · unit price')
    expect(view.sides.map(s => s.choice.value)).toEqual([9400, 9900])
    const [row] = await sql<{ unit_price_cents: number }>('select unit_price_cents from job_parts where id = ?', [partId])
    expect(Number(row!.unit_price_cents)).toBe(9900)
    await tech.engine.pull()
    expect((await tech.db.jobParts.get(partId))!.unitPriceCents).toBe(9900)
  })
})
