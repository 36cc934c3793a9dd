import { beforeEach, describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { JobsCheckInForm } from '#components'
import { fieldError } from './helpers'
import { offlineShop, until } from './helpers/jobs'
import { SHOP_ID } from './helpers/device'

beforeEach(() => {
  localStorage.clear()
  useSessionStore().me = null
})

describe('check-in form', () => {
  it('shows each problem beside its field and saves nothing', async () => {
    const { sync } = await offlineShop('owner')
    const w = await mountSuspended(JobsCheckInForm)
    await w.find('form').trigger('submit')
    await until(() => fieldError(w, 'ci-complaint').exists(), 'the complaint error')
    expect(fieldError(w, 'ci-complaint').text()).toBe('say what the customer reports')
    expect(fieldError(w, 'ci-customer-search').text()).toBe('choose a customer, or add a new one')
    expect(fieldError(w, 'ci-amp-description').text()).toBe('describe the amp')
    expect(w.find('#ci-complaint').attributes('aria-describedby')).toBe('ci-complaint-error')

    await w.find('[data-testid="new-customer"]').trigger('click')
    await w.find('#ci-customer-email').setValue('dana@')
    await w.find('#ci-amp-count').setValue('two')
    await w.find('#ci-accessories').setValue('x'.repeat(501))
    await w.find('form').trigger('submit')
    await until(() => fieldError(w, 'ci-customer-name').exists(), 'the customer errors')
    expect(fieldError(w, 'ci-customer-name').text()).toBe('enter a name')
    expect(fieldError(w, 'ci-customer-email').text()).toBe('enter a valid e-mail address')
    expect(fieldError(w, 'ci-amp-count').text()).toBe('enter a whole number from 0 to 16')
    expect(fieldError(w, 'ci-accessories').text()).toBe('at most 500 characters')
    expect(await sync.db!.outbox.where('shopId').equals(SHOP_ID).count()).toBe(0)
  })

  it('a valid check-in saves customer, amp and job on the device, linked', async () => {
    const { sync } = await offlineShop('owner')
    const w = await mountSuspended(JobsCheckInForm)
    await w.find('[data-testid="new-customer"]').trigger('click')
    await w.find('#ci-customer-name').setValue('Dana Whitlow')
    await w.find('#ci-customer-email').setValue('dana@players.example')
    await w.find('#ci-amp-description').setValue('two-6V6 combo, fixed bias')
    await w.find('#ci-amp-serial').setValue('LW-6V6-0142')
    await w.find('#ci-complaint').setValue('Hum at idle, worse when warm')
    await w.find('#ci-promised').setValue('2026-12-10')
    await w.find('form').trigger('submit')
    await until(() => w.emitted('done') !== undefined, 'the check-in to finish')
    const queued = await sync.db!.outbox.where('shopId').equals(SHOP_ID).sortBy('id')
    expect(queued.map(m => m.name)).toEqual(['customer.create', 'amp.create', 'job.create'])
    const [c, a, j] = queued.map(m => m.args as Record<string, unknown>)
    expect(a).toMatchObject({ customerId: c!.id, serial: 'LW-6V6-0142', powerTubeCount: 2, biasMode: 'fixed' })
    expect(j).toMatchObject({ customerId: c!.id, ampId: a!.id, status: 'checked-in', promisedFor: '2026-12-10', photos: [], assignedTo: null })
    expect(w.emitted('done')![0]).toEqual([j!.id])
  })
})
