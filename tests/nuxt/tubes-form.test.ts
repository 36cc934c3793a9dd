import { describe, expect, it, vi } from 'vitest'
import { mountSuspended, registerEndpoint } from '@nuxt/test-utils/runtime'
import { flushPromises } from '@vue/test-utils'
import { TubesForm } from '#components'

describe('Tubes: add a shop entry', () => {
  it('shows a message beside each field that is wrong, and sends nothing', async () => {
    let posted = 0
    registerEndpoint('/api/tubes', { method: 'POST', handler: () => { posted++; return {} } })
    const w = await mountSuspended(TubesForm)
    await w.find('#tube-new-plate-w').setValue('fourteen')
    await w.find('#tube-new-screen-w').setValue('-2')
    await w.find('form').trigger('submit')
    await flushPromises()
    expect(w.find('#tube-new-name-error').text()).toBe('enter a name')
    expect(w.find('#tube-new-plate-w-error').text()).toBe('"fourteen" is not a number')
    expect(w.find('#tube-new-screen-w-error').text()).toBe('enter the maximum screen dissipation in W, a positive number')
    expect(w.find('#tube-new-plate-v-error').text()).toBe('enter a value')
    expect(w.find('#tube-new-source-error').exists()).toBe(true)
    expect(posted).toBe(0)
  })

  it('sends the figures in SI numbers and keeps the new entry in the store', async () => {
    let body: Record<string, unknown> = {}
    registerEndpoint('/api/tubes', {
      method: 'POST',
      handler: async (event) => {
        const { readBody } = await import('h3')
        body = await readBody(event)
        return { ...body, id: '0b7c1e0e-0000-4000-8000-00000000abcd', kind: 'shop' }
      },
    })
    useSessionStore().me = {
      user: { id: 'u1', name: 'Owen Pryde', email: 'tech@larkspur.example' },
      memberships: [],
      activeShop: { id: 's1', name: 'Larkspur Amp Works', role: 'tech' },
    }
    const w = await mountSuspended(TubesForm)
    await w.find('#tube-new-name').setValue('EL84 (shop sheet)')
    await w.find('#tube-new-plate-w').setValue('12 W')
    await w.find('#tube-new-screen-w').setValue('2')
    await w.find('#tube-new-plate-v').setValue('300')
    await w.find('#tube-new-heater').setValue('6.3 V 0.76 A')
    await w.find('#tube-new-source').setValue('Maker data sheet, shop copy')
    await w.find('form').trigger('submit')
    await vi.waitFor(() => expect(w.emitted('done')).toHaveLength(1))
    expect(w.find('[role="alert"]').exists()).toBe(false)
    expect(body).toMatchObject({ name: 'EL84 (shop sheet)', maxPlateWatts: 12, maxScreenWatts: 2, maxPlateVolts: 300, ratingSystem: 'design-maximum' })
    expect(useTubesStore().all.find(t => t.name === 'EL84 (shop sheet)')).toMatchObject({ kind: 'shop', maxPlateWatts: 12 })
  })
})
