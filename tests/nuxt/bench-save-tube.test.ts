import { describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { BenchSave } from '#components'
import { computeTool } from '#shared/utils/bench'
import { offlineShop, until } from './helpers/jobs'
import { useCustomersStore } from '~/stores/customers'
import { useAmpsStore } from '~/stores/amps'
import { useJobsStore } from '~/stores/jobs'
import { useMeasurementsStore } from '~/stores/measurements'

// One 6V6GTA of a fixed-bias pair, read directly: 285 V, 35 mA, 14 W rating.
// Source: RCA RC-30 tube manual, 6V6GT typical operation (285 V, 70 mA for two); 6V6GTA 14 W design maximum.
const inputs = { tubeId: '6v6gta', method: 'direct', mode: 'fixed', plateVolts: 285, amps: 0.035, maxPlateWatts: 14 }

async function jobWithAmp(tubeComplement: string) {
  const customerId = await useCustomersStore().create({ name: 'Tube Check' })
  const ampId = await useAmpsStore().create({ customerId, description: '100 W four-6L6 head', serial: 'TC-1', tubeComplement })
  return useJobsStore().create({ customerId, ampId, complaint: 'Bias check' })
}

describe('saving a reading to a job whose amp has other tubes', () => {
  it('asks first, saves nothing on "Not now", and saves on "Save anyway"', async () => {
    await offlineShop('tech')
    const jobId = await jobWithAmp('3 x 12AX7, 4 x 6L6GC')
    const store = useMeasurementsStore()
    const w = await mountSuspended(BenchSave, { props: { tool: 'idle-dissipation', inputs, outputs: computeTool('idle-dissipation', inputs) } })
    await until(() => w.findAll('[data-testid="save-target"] option').some(o => o.attributes('value') === jobId), 'the job in the picker')
    await w.find('[data-testid="save-target"]').setValue(jobId)
    await w.find('button.btn-primary').trigger('click')
    await until(() => w.find('[data-testid="tube-mismatch"]').exists(), 'the question')
    expect(w.find('[data-testid="tube-mismatch"]').text()).toContain('6L6GC power tubes, but this reading is worked out for a 6V6GTA')
    await w.findAll('[data-testid="tube-mismatch"] button').find(b => b.text() === 'Not now')!.trigger('click')
    await new Promise(r => setTimeout(r, 50))
    expect(store.forJob(jobId)).toHaveLength(0)

    await w.find('button.btn-primary').trigger('click')
    await until(() => w.find('[data-testid="tube-mismatch-save"]').exists(), 'the question again')
    await w.find('[data-testid="tube-mismatch-save"]').trigger('click')
    await until(() => store.forJob(jobId).length === 1, 'the reading on the job')
  })

  it('saves straight away when the amp carries the same tube', async () => {
    await offlineShop('tech')
    const jobId = await jobWithAmp('2 x 12AX7, 2 x 6V6GTA')
    const store = useMeasurementsStore()
    const w = await mountSuspended(BenchSave, { props: { tool: 'idle-dissipation', inputs, outputs: computeTool('idle-dissipation', inputs) } })
    await until(() => w.findAll('[data-testid="save-target"] option').some(o => o.attributes('value') === jobId), 'the job in the picker')
    await w.find('[data-testid="save-target"]').setValue(jobId)
    await w.find('button.btn-primary').trigger('click')
    await until(() => store.forJob(jobId).length === 1, 'the reading on the job')
    expect(w.find('[data-testid="tube-mismatch"]').exists()).toBe(false)
  })
})
