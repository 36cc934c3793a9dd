import { beforeEach, describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { JobsLabour, JobsParts } from '#components'
import { offlineShop, seedJob, until } from './helpers/jobs'
import { useJobPartsStore } from '~/stores/jobParts'
import { useJobLabourStore } from '~/stores/jobLabour'

beforeEach(() => {
  localStorage.clear()
  useSessionStore().me = null
})

async function partsForm() {
  await offlineShop('tech')
  const jobId = await seedJob({ customer: 'Dana Whitlow', amp: 'two-6V6 combo, fixed bias', serial: 'LW-6V6-0142', complaint: 'Hum' })
  const w = await mountSuspended(JobsParts, { props: { jobId, currency: 'USD' } })
  return { jobId, w }
}

describe('money fields on a job', () => {
  it('reads a decimal comma as cents, says what it understood, and adds that amount', async () => {
    const { jobId, w } = await partsForm()
    await w.find('#part-description').setValue('Output transformer')
    await w.find('#part-price').setValue('89,50')
    // Source: the case; "89,50" is eighty-nine and a half, not 8,950.
    expect(w.find('[data-testid="part-price-reads"]').text()).toBe('Reads as $89.50')
    await w.find('form').trigger('submit')
    const parts = useJobPartsStore()
    await until(() => parts.forJob(jobId).length === 1, 'the part on the job')
    expect(parts.forJob(jobId)[0]!.unitPriceCents).toBe(8950)
    await until(() => w.find('[data-testid="job-parts"]').text().includes('1 × $89.50'), 'the line at $89.50')
  })

  it('refuses a negative or wordy price with a message and adds nothing', async () => {
    const { jobId, w } = await partsForm()
    await w.find('#part-description').setValue('Bias pot')
    await w.find('#part-price').setValue('-4')
    await w.find('form').trigger('submit')
    await until(() => w.find('#part-price-error').exists(), 'the price error')
    expect(w.find('#part-price-error').text()).toMatch(/negative/)
    await w.find('#part-price').setValue('four dollars')
    await w.find('form').trigger('submit')
    await until(() => /digits/.test(w.find('#part-price-error').text()), 'the wording error')
    expect(useJobPartsStore().forJob(jobId)).toHaveLength(0)
  })

  it('reads a labour rate written with grouping and a decimal comma', async () => {
    await offlineShop('tech')
    const jobId = await seedJob({ customer: 'Sam Okafor', amp: '100 W four-6L6 head', serial: 'LW-6L6-0007', complaint: 'No sound' })
    const w = await mountSuspended(JobsLabour, { props: { jobId, currency: 'USD', defaultRateCents: null } })
    await w.find('#labour-minutes').setValue('60')
    await w.find('#labour-rate').setValue('1.234,50')
    expect(w.find('[data-testid="labour-rate-reads"]').text()).toBe('Reads as $1,234.50')
    await w.find('form').trigger('submit')
    const labour = useJobLabourStore()
    await until(() => labour.forJob(jobId).length === 1, 'the labour line')
    expect(labour.forJob(jobId)[0]!.rateCents).toBe(123450)
  })
})
