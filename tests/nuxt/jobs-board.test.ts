import { beforeEach, describe, expect, it } from 'vitest'
import type { VueWrapper } from '@vue/test-utils'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { JobsTable } from '#components'
import JobsBoardPage from '~/pages/jobs/index.vue'
import { offlineShop, seedJob, until } from './helpers/jobs'
import { useJobsStore } from '~/stores/jobs'

beforeEach(() => {
  // A phone: the board shows cards below 768 px.
  ;(window as any).happyDOM?.setViewport({ width: 360, height: 800 })
  localStorage.clear()
  useSessionStore().me = null
})

async function threeJobs(me: string) {
  await seedJob({ customer: 'Dana Whitlow', amp: 'two-6V6 combo, fixed bias', serial: 'LW-6V6-0142', complaint: 'Hum at idle', status: 'on-bench', promisedFor: '2026-12-10', assignedTo: me })
  await seedJob({ customer: 'Sam Okafor', amp: '100 W four-6L6 head', serial: 'SO-6L6-7731', complaint: 'Crackles when warm', status: 'ready', promisedFor: '2026-12-03' })
  await seedJob({ customer: 'Ada Fenwick', amp: '18 W two-EL84 combo, cathode biased', serial: 'AF-EL84-0007', complaint: 'No sound from the clean channel' })
  await until(() => useJobsStore().board.length === 3 && useJobsStore().board.every(b => b.ampSerial), 'three jobs on the board')
}

const counts = (w: VueWrapper) =>
  Object.fromEntries(w.findAll('[data-filter]').map(b => [b.attributes('data-filter'), Number(b.find('[data-testid="filter-count"]').text())]))
const cardSerials = (w: VueWrapper) => w.findAll('[data-testid="job-card"]').map(c => c.text().match(/[A-Z]{2}-\w+-\d{4}/)?.[0])

describe('job board', () => {
  it('counts per status, filters by chip, search and my bench, and sorts by the picker', async () => {
    const { user } = await offlineShop('tech')
    await threeJobs(user.id)
    const w = await mountSuspended(JobsBoardPage)
    await until(() => w.findAll('[data-testid="job-card"]').length === 3, 'three cards')

    expect(counts(w)).toMatchObject({ 'open': 3, 'all': 3, 'checked-in': 1, 'on-bench': 1, 'ready': 1, 'closed': 0 })
    // Default sort: promised date, undated last.
    expect(cardSerials(w)).toEqual(['SO-6L6-7731', 'LW-6V6-0142', 'AF-EL84-0007'])

    await w.find('[data-filter="ready"]').trigger('click')
    await until(() => w.findAll('[data-testid="job-card"]').length === 1, 'only the ready job')
    expect(cardSerials(w)).toEqual(['SO-6L6-7731'])
    expect(w.find('[data-testid="job-card"] [data-testid="job-status"]').attributes('data-status')).toBe('ready')

    await w.find('[data-filter="open"]').trigger('click')
    await w.find('#jobs-search').setValue('crackles')
    await until(() => w.findAll('[data-testid="job-card"]').length === 1, 'the search to narrow the list')
    expect(cardSerials(w)).toEqual(['SO-6L6-7731'])
    expect(counts(w)).toMatchObject({ 'open': 1, 'ready': 1, 'on-bench': 0 })

    await w.find('#jobs-search').setValue('af-el84')
    await until(() => cardSerials(w).join() === 'AF-EL84-0007', 'search by serial')

    await w.find('#jobs-search').setValue('')
    await w.find('[data-testid="my-bench"]').setValue(true)
    await until(() => w.findAll('[data-testid="job-card"]').length === 1, 'my bench only')
    expect(cardSerials(w)).toEqual(['LW-6V6-0142'])
    expect(counts(w).open).toBe(1)

    await w.find('[data-testid="my-bench"]').setValue(false)
    await w.find('#jobs-sort').setValue('customer')
    await until(() => cardSerials(w).length === 3, 'all three again')
    expect(cardSerials(w)).toEqual(['AF-EL84-0007', 'LW-6V6-0142', 'SO-6L6-7731'])
  })

  it('the wide table sorts by the column header clicked', async () => {
    const { user } = await offlineShop('owner')
    await threeJobs(user.id)
    const w = await mountSuspended(JobsTable, { props: { rows: useJobsStore().board } })
    const serials = () => w.findAll('[data-testid="job-row"]').map(r => r.text().match(/[A-Z]{2}-\w+-\d{4}/)?.[0])
    await w.find('[data-sort="customer"]').trigger('click')
    await until(() => serials()[0] === 'AF-EL84-0007', 'ascending by customer')
    expect(serials()).toEqual(['AF-EL84-0007', 'LW-6V6-0142', 'SO-6L6-7731'])
    expect(w.find('th[aria-sort="ascending"]').text()).toContain('Customer')
    await w.find('[data-sort="customer"]').trigger('click')
    await until(() => serials()[0] === 'SO-6L6-7731', 'descending by customer')
    expect(serials()).toEqual(['SO-6L6-7731', 'LW-6V6-0142', 'AF-EL84-0007'])
    await w.find('[data-sort="status"]').trigger('click')
    // In the order of the work: checked-in, on-bench, ready.
    await until(() => serials()[0] === 'AF-EL84-0007', 'by status')
    expect(serials()).toEqual(['AF-EL84-0007', 'LW-6V6-0142', 'SO-6L6-7731'])
  })

  it('shows an empty board with words, not a blank page', async () => {
    await offlineShop('owner')
    const w = await mountSuspended(JobsBoardPage)
    await until(() => w.find('[data-testid="jobs-empty"]').exists(), 'the empty state')
    expect(w.text()).toContain('No jobs yet')
    expect(w.find('a[href="/jobs/new"]').exists()).toBe(true)
  })
})
