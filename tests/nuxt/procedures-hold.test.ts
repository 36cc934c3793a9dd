import { beforeEach, describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { ProceduresHoldTimer } from '#components'
import { STORAGE_KEYS } from '~/utils/storage-keys'

const runId = '0b7d0c1e-0000-4000-8000-00000000a001'
const props = { seconds: 30, reason: 'Let the tubes settle', runId, stepKey: 'settle' }

beforeEach(() => localStorage.clear())

describe('a procedure hold across a reload', () => {
  it('keeps its start time on the device when started', async () => {
    const w = await mountSuspended(ProceduresHoldTimer, { props })
    expect(w.find('[data-testid="hold-clock"]').text()).toBe('0:30')
    await w.find('[data-testid="hold-start"]').trigger('click')
    const kept = Number(localStorage.getItem(STORAGE_KEYS.holdStart(runId, 'settle')))
    expect(Math.abs(Date.now() - kept)).toBeLessThan(2_000)
    expect(w.find('[data-testid="hold-start"]').exists()).toBe(false)
  })

  it('resumes a wait started 20 s before the reload with 10 s left', async () => {
    localStorage.setItem(STORAGE_KEYS.holdStart(runId, 'settle'), String(Date.now() - 20_000))
    const w = await mountSuspended(ProceduresHoldTimer, { props })
    await nextTick()
    expect(w.find('[data-testid="hold-start"]').exists()).toBe(false)
    expect(w.find('[data-testid="hold-clock"]').text()).toBe('0:10')
  })

  it('a wait already over when the page comes back says so and lets the step go on', async () => {
    localStorage.setItem(STORAGE_KEYS.holdStart(runId, 'settle'), String(Date.now() - 45_000))
    const w = await mountSuspended(ProceduresHoldTimer, { props })
    await nextTick()
    expect(w.find('[data-testid="hold-clock"]').text()).toBe('Wait over')
    expect(w.emitted('done')).toHaveLength(1)
  })
})
