import { beforeEach, describe, expect, it } from 'vitest'
import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { JobsCheckInForm } from '#components'
import { offlineShop, until } from './helpers/jobs'
import { SHOP_ID } from './helpers/device'

beforeEach(() => {
  localStorage.clear()
  useSessionStore().me = null
})

const RIG = '6f1c2a10-0000-4000-8010-000000000001'

describe('check-in with a rig the player shares', () => {
  it('fills the amp from the shared rig and links the new amp to it; picking it again unlinks', async () => {
    registerEndpoint('/api/rigs', () => ({
      items: [{
        id: RIG, access: 'shared', playerUserId: crypto.randomUUID(), playerName: 'Dana Whitlow', description: '18 W two-EL84 combo, cathode biased',
        serial: 'LAW-0412', biasMode: 'cathode', tubes: [{ position: 'V1', type: '12AX7' }, { position: 'V4', type: 'EL84' }, { position: 'V5', type: 'EL84' }],
        speakerLoadOhms: 8, outputTapOhms: 8, retubeHours: 120, retubeMonths: 12, notes: '', version: 3, createdBy: crypto.randomUUID(), updatedBy: null, createdAt: '', updatedAt: '',
      }],
    }))
    const { sync } = await offlineShop('owner')
    const w = await mountSuspended(JobsCheckInForm)
    await w.find('[data-testid="new-customer"]').trigger('click')
    await w.find('#ci-customer-name').setValue('Dana Whitlow')
    await until(() => w.find('[data-testid="rig-pick"] button').exists(), 'the shared rig to show')
    const pick = w.find('[data-testid="rig-pick"] button')
    expect(pick.text()).toContain('Dana Whitlow')

    await pick.trigger('click')
    expect(pick.attributes('aria-pressed')).toBe('true')
    expect((w.find('#ci-amp-description').element as HTMLInputElement).value).toBe('18 W two-EL84 combo, cathode biased')
    expect((w.find('#ci-amp-count').element as HTMLInputElement).value).toBe('2')
    await pick.trigger('click')
    expect(pick.attributes('aria-pressed')).toBe('false')
    await pick.trigger('click')

    await w.find('#ci-complaint').setValue('Crackles when warm')
    await w.find('form').trigger('submit')
    await until(() => w.emitted('done') !== undefined, 'the check-in to finish')
    const amp = (await sync.db!.outbox.where('shopId').equals(SHOP_ID).sortBy('id')).find(m => m.name === 'amp.create')!
    expect(amp.args).toMatchObject({ rigId: RIG, description: '18 W two-EL84 combo, cathode biased', serial: 'LAW-0412', biasMode: 'cathode', powerTubeCount: 2, tubeComplement: '2 × EL84' })
  })
})
