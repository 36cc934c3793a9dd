// A lot and its readings typed on the Tube stock screen, saved on a device with no server.
import { beforeEach, describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { StockLotForm } from '#components'
import { testid, type } from './helpers'
import { SHOP_ID } from './helpers/device'
import { offlineShop, until } from './helpers/jobs'

beforeEach(() => {
  localStorage.clear()
  useSessionStore().me = null
})

const queued = async () => (await useSyncStore().db!.outbox.where('shopId').equals(SHOP_ID).sortBy('id')).map(m => m.name)

describe('StockLotForm', () => {
  it('saves the lot and each tube read at the stated test point, in SI', async () => {
    await offlineShop('tech')
    const w = await mountSuspended(StockLotForm)
    await w.find('#lot-type').setValue('el84')
    await type(w, '#lot-maker', 'Generic EL84')
    await type(w, '#lot-cost', '13')
    await type(w, '#lot-point-plate', '250')
    await type(w, '#lot-point-grid', '-7.3')
    await type(w, '#lot-readings', 'A 31\nB 33.4 4.5\n29.1 mA')
    await testid(w, 'lot-form').trigger('submit')
    const stock = useStockStore()
    await until(() => stock.tubes.length === 3, 'three tubes')
    expect(w.emitted('done')?.[0]).toEqual([stock.lots[0]!.id])
    expect(stock.lots[0]).toMatchObject({ tubeType: 'el84', maker: 'Generic EL84', costCents: 1300 })
    const tubes = stock.tubesOfLot(stock.lots[0]!.id)
    expect(tubes.map(t => t.label)).toEqual(['A', 'B', 'L1-03'])
    // Source: SI prefix m = 1e-3 (BIPM SI Brochure, 9th ed.): 33.4 mA = 0.0334 A, 4.5 mA/V = 0.0045 S
    expect(tubes[1]!.amps).toBeCloseTo(0.0334, 12)
    expect(tubes[1]!.transconductance).toBeCloseTo(0.0045, 12)
    expect(tubes[0]!.transconductance).toBeNull()
    expect(tubes.every(t => t.plateVolts === 250 && t.gridVolts === -7.3 && t.testedBy === 'Owen Pryde' && t.setId === null)).toBe(true)
    expect(await queued()).toEqual(['tubeLot.create', 'stockTube.create', 'stockTube.create', 'stockTube.create'])
  })

  it('shows each problem beside its field and queues nothing', async () => {
    await offlineShop('tech')
    const w = await mountSuspended(StockLotForm)
    await type(w, '#lot-point-plate', '250')
    await type(w, '#lot-point-grid', '7.3')
    await type(w, '#lot-readings', 'A 31\nB thirty')
    await testid(w, 'lot-form').trigger('submit')
    expect(w.find('#lot-readings-error').text()).toBe('line 2: give the current, then (optionally) the transconductance in mA/V')
    await type(w, '#lot-readings', 'A 31\nA 32')
    await testid(w, 'lot-form').trigger('submit')
    await until(() => w.find('#lot-type-error').exists(), 'the tube type message')
    expect(w.find('#lot-type-error').text()).toBe('pick a tube type')
    expect(w.find('#lot-readings-error').text()).toBe('line 2: the label A is used twice')
    expect(await queued()).toEqual([])
    expect(await useSyncStore().db!.tubeLots.count()).toBe(0)
  })
})
