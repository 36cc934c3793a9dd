// Tube sorter results saved into stock, and a set fitted to a job, on a device with no server.
import { beforeEach, describe, expect, it } from 'vitest'
import { flushPromises } from '@vue/test-utils'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { BenchTubeSorter, JobsFitSet } from '#components'
import { choose, testid, type } from './helpers'
import { SHOP_ID } from './helpers/device'
import { offlineShop, seedJob, until } from './helpers/jobs'

beforeEach(() => {
  localStorage.clear()
  useSessionStore().me = null
})

async function outbox() {
  const sync = useSyncStore()
  return (await sync.db!.outbox.where('shopId').equals(SHOP_ID).sortBy('id')).map(m => ({ name: m.name, args: m.args as Record<string, unknown> }))
}

async function sortAndSave() {
  const w = await mountSuspended(BenchTubeSorter)
  // One tube typed without a label; the current is in mA.
  await type(w, '#sorter-readings', 'A1 40\nA2 42\nA3 50\nA4 51\n45')
  await choose(w, 'Pairs')
  await type(w, '#sorter-tolerance', '5')
  await testid(w, 'sorter-stock-open').trigger('click')
  await flushPromises()
  await w.find('#sorter-stock-type').setValue('6l6gc')
  await type(w, '#sorter-stock-maker', 'Generic 6L6GC')
  await type(w, '#sorter-stock-cost', '21.50')
  await type(w, '#sorter-stock-point-plate', '400')
  // A phone keypad has no minus: the grid bias is read as negative.
  await type(w, '#sorter-stock-point-grid', '45')
  await testid(w, 'sorter-stock').find('form').trigger('submit')
  await until(() => testid(w, 'sorter-stock').text().includes('into stock on this device'), 'the save')
  await until(() => useStockStore().sets.length === 2, 'the two sets in stock')
  return w
}

describe('Save these sets into stock', () => {
  it('queues the sort, the lot, every tube read and each pair, in the order the server takes them', async () => {
    await offlineShop('tech')
    const w = await sortAndSave()
    expect(testid(w, 'sorter-stock').text()).toContain('Saved 5 tubes and 2 sets into stock on this device.')
    const queued = await outbox()
    expect(queued.map(m => m.name)).toEqual([
      'measurement.create', 'tubeLot.create',
      'stockTube.create', 'stockTube.create', 'stockTube.create', 'stockTube.create', 'stockTube.create',
      'matchedSet.create', 'matchedSet.create',
    ])
    expect(queued[1]!.args).toMatchObject({ tubeType: '6l6gc', maker: 'Generic 6L6GC', costCents: 2150 })

    const stock = useStockStore()
    const [lot] = stock.lots
    const tubes = stock.tubesOfLot(lot!.id)
    expect(tubes.map(t => t.label)).toEqual(['A1', 'A2', 'A3', 'A4', 'L1-05'])
    expect(tubes.every(t => t.plateVolts === 400 && t.gridVolts === -45 && t.testedBy === 'Owen Pryde')).toBe(true)
    const [s1, s2] = stock.sets
    expect(s1).toMatchObject({ label: 'S-1', size: 2, status: 'in-stock', sorterResultId: queued[0]!.args.id })
    expect(stock.tubesOfSet(s1!).map(t => t.label)).toEqual(['A1', 'A2'])
    expect(stock.tubesOfSet(s2!).map(t => t.label)).toEqual(['A3', 'A4'])
    // common practice, no source: spread = highest / lowest − 1; by hand 42 / 40 − 1 = 5 %, 51 / 50 − 1 = 2 %
    expect(s1!.spreadFraction).toBeCloseTo(0.05, 12)
    expect(s2!.spreadFraction).toBeCloseTo(0.02, 12)
    // Each tube is marked for its set, the odd one for none.
    expect(Object.fromEntries(tubes.map(t => [t.label, t.setId]))).toEqual({ 'A1': s1!.id, 'A2': s1!.id, 'A3': s2!.id, 'A4': s2!.id, 'L1-05': null })
  })

  it('says a sort into sixes cannot go into stock', async () => {
    await offlineShop('tech')
    const w = await mountSuspended(BenchTubeSorter)
    await type(w, '#sorter-readings', 'A1 40\nA2 40\nA3 40\nA4 40\nA5 40\nA6 40')
    await choose(w, 'Sixes')
    expect(testid(w, 'sorter-stock').text()).toContain('Stock keeps pairs and quads')
    expect(testid(w, 'sorter-stock-open').exists()).toBe(false)
  })

  it('is not offered to a player, whose sorter is their own', async () => {
    await offlineShop('player')
    const w = await mountSuspended(BenchTubeSorter)
    await type(w, '#sorter-readings', 'A1 40\nA2 41')
    await choose(w, 'Pairs')
    expect(testid(w, 'sets').findAll('li')).toHaveLength(1)
    expect(testid(w, 'sorter-stock').exists()).toBe(false)
  })
})

describe('Fit a matched set from stock', () => {
  it('fits a set to the job as one change, shows it fitted while the part waits for the server, and refuses a second fit', async () => {
    await offlineShop('tech')
    await sortAndSave()
    const jobId = await seedJob({ customer: 'Sam Okafor', amp: 'four-6L6 head', serial: 'LW-6L6-0007', complaint: 'Retube' })
    const stock = useStockStore()
    const s1 = stock.sets.find(s => s.label === 'S-1')!
    const w = await mountSuspended(JobsFitSet, { props: { jobId, currency: 'usd' } })
    await until(() => w.find('#fit-set').exists(), `the set picker in: ${w.text()}`)
    await w.find('#fit-set').setValue(s1.id)
    await type(w, '#fit-price', '64')
    const before = (await outbox()).length
    await w.find('form').trigger('submit')
    await until(() => stock.set(s1.id)?.status === 'fitted', 'the set fitted')
    const queued = (await outbox()).slice(before)
    expect(queued).toHaveLength(1)
    expect(queued[0]).toMatchObject({ name: 'matchedSet.setFields', args: { id: s1.id, fields: { status: 'fitted', fittedJobId: jobId, priceCents: 6400 } } })
    await until(() => testid(w, 'fitted-sets').exists(), 'the fitted list')
    expect(testid(w, 'fitted-sets').text()).toContain('Fitted: S-1, matched pair 6L6GC')
    expect(testid(w, 'fitted-sets').text()).toContain('the part is added when it syncs')
    // Only S-2 is left to offer.
    expect(w.findAll('#fit-set option').map(o => o.text()).filter(t => t.startsWith('S-'))).toEqual([expect.stringContaining('S-2 · pair 6L6GC')])
    await expect(stock.fit(s1.id, jobId)).rejects.toThrow('Set S-1 is already fitted to a job.')
    expect((await outbox()).length).toBe(before + 1)
  })
})
