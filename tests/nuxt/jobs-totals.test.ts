import { beforeEach, describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { JobsTotals } from '#components'
import { offlineShop, seedJob, until } from './helpers/jobs'
import { useJobPartsStore } from '~/stores/jobParts'
import { useJobLabourStore } from '~/stores/jobLabour'

beforeEach(() => {
  localStorage.clear()
  useSessionStore().me = null
})

describe('job totals', () => {
  it('shows the hand-worked totals for two parts and one labour line at 8.25 % tax', async () => {
    await offlineShop('tech')
    const jobId = await seedJob({ customer: 'Dana Whitlow', amp: 'two-6V6 combo, fixed bias', serial: 'LW-6V6-0142', complaint: 'Hum' })
    const parts = useJobPartsStore()
    const labour = useJobLabourStore()
    await parts.add({ jobId, description: 'Matched pair 6V6GT', quantity: 2, unitCostCents: 1100, unitPriceCents: 1850 })
    await parts.add({ jobId, description: 'Bias trim pot', quantity: 1, unitPriceCents: 425 })
    await labour.add({ jobId, description: 'Set bias, soak', minutes: 75, rateCents: 8400 })
    await until(() => parts.forJob(jobId).length === 2 && labour.forJob(jobId).length === 1, 'parts and labour')

    const w = await mountSuspended(JobsTotals, { props: { jobId, currency: 'USD', taxRateBasisPoints: 825 } })
    const shown = (k: string) => w.find(`[data-testid="total-${k}"]`).text()
    // Source: arithmetic, worked by hand: parts 2 × $18.50 + 1 × $4.25 = $41.25
    expect(shown('parts')).toBe('$41.25')
    // Source: arithmetic, worked by hand: 75 min at $84.00/h = 1.25 h × $84.00 = $105.00
    expect(shown('labour')).toBe('$105.00')
    // Source: arithmetic, worked by hand: $41.25 + $105.00 = $146.25
    expect(shown('subtotal')).toBe('$146.25')
    // Source: arithmetic, worked by hand: 8.25 % of $146.25 = $12.065625, rounded to the cent $12.07
    expect(shown('tax')).toBe('$12.07')
    // Source: arithmetic, worked by hand: $146.25 + $12.07 = $158.32
    expect(shown('total')).toBe('$158.32')

    await labour.remove(labour.forJob(jobId)[0]!.id)
    // Source: arithmetic, worked by hand: $41.25 × 1.0825 = $44.653…, tax $3.40 → $44.65
    await until(() => w.find('[data-testid="total-total"]').text() === '$44.65', 'the total without labour')
    expect(shown('tax')).toBe('$3.40')
  })
})
