// One line-items component for parts and labour: the record schema's messages sit beside their fields.
import { beforeEach, describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { JobsLineItems } from '#components'
import { ENTITY_FIELDS } from '#shared/utils/sync/entities'
import { offlineShop, seedJob, until } from './helpers/jobs'
import { useJobPartsStore } from '~/stores/jobParts'
import { useJobLabourStore } from '~/stores/jobLabour'

beforeEach(() => {
  localStorage.clear()
  useSessionStore().me = null
})

async function lines(kind: 'part' | 'labour') {
  await offlineShop('tech')
  const jobId = await seedJob({ customer: 'Dana Whitlow', amp: 'two-6V6 combo, fixed bias', serial: 'LW-6V6-0142', complaint: 'Hum' })
  const w = await mountSuspended(JobsLineItems, { props: { kind, jobId, currency: 'USD' } })
  return { jobId, w }
}

describe('job line items', () => {
  it('shows the record schema\'s message for a part description that is too long, beside that field, and adds nothing', async () => {
    const { jobId, w } = await lines('part')
    await w.find('#part-description').setValue('x'.repeat(201))
    await w.find('#part-price').setValue('4.25')
    await w.find('form').trigger('submit')
    await until(() => w.find('#part-description-error').exists(), 'the description error')
    // The same message the server's schema gives for this field.
    const expected = ENTITY_FIELDS.jobParts.shape.description.safeParse('x'.repeat(201)).error?.issues[0]?.message
    expect(expected).toBe('at most 200 characters')
    expect(w.find('#part-description-error').text()).toBe(expected)
    expect(w.find('#part-description').attributes('aria-invalid')).toBe('true')
    expect(w.find('#part-price-error').exists()).toBe(false)
    expect(useJobPartsStore().forJob(jobId)).toHaveLength(0)

    // Fixed, the line goes in and the form starts again.
    await w.find('#part-description').setValue('Bias trim pot')
    await w.find('form').trigger('submit')
    await until(() => useJobPartsStore().forJob(jobId).length === 1, 'the part')
    expect(w.find('#part-description-error').exists()).toBe(false)
    expect((w.find('#part-description').element as HTMLInputElement).value).toBe('')
    expect((w.find('#part-quantity').element as HTMLInputElement).value).toBe('1')
    await until(() => w.find('[data-testid="job-parts"]').text().includes('1 × $4.25'), 'the line in the list')
  })

  it('puts the schema\'s limit on labour minutes beside the minutes, and keeps the rate after a line is added', async () => {
    const { jobId, w } = await lines('labour')
    await w.find('#labour-minutes').setValue('200000')
    await w.find('#labour-rate').setValue('84')
    await w.find('form').trigger('submit')
    await until(() => w.find('#labour-minutes-error').exists(), 'the minutes error')
    expect(ENTITY_FIELDS.jobLabour.shape.minutes.safeParse(200000).success).toBe(false)
    expect(w.find('#labour-minutes-error').text()).toBe('at most 100,000')
    expect(useJobLabourStore().forJob(jobId)).toHaveLength(0)

    await w.find('#labour-minutes').setValue('1.5')
    await w.find('form').trigger('submit')
    await until(() => w.find('#labour-minutes-error').text() === 'whole minutes, more than 0', 'the whole-minutes message')

    await w.find('#labour-minutes').setValue('45')
    await w.find('form').trigger('submit')
    await until(() => useJobLabourStore().forJob(jobId).length === 1, 'the labour line')
    // Source: arithmetic, worked by hand: 45 min at $84.00/h = 0.75 h × $84.00 = $63.00
    await until(() => w.find('[data-testid="job-labour"]').text().includes('$63.00'), 'the line total')
    expect(w.find('[data-testid="job-labour"]').text()).toContain('Bench time')
    expect((w.find('#labour-rate').element as HTMLInputElement).value).toBe('84')
    expect((w.find('#labour-minutes').element as HTMLInputElement).value).toBe('')
  })
})
