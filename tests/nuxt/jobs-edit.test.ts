import { beforeEach, describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { JobsEditForm } from '#components'
import { offlineShop, seedJob, until } from './helpers/jobs'
import { useJobsStore } from '~/stores/jobs'
import { useSyncStore } from '~/stores/sync'

beforeEach(() => {
  localStorage.clear()
  useSessionStore().me = null
})

describe('changing a job after check-in', () => {
  it('changes promised date, priority, complaint and accessories offline, as one queued edit', async () => {
    await offlineShop('owner')
    const id = await seedJob({ customer: 'Sam Okafor', amp: '100 W four-6L6 head', serial: 'LAW-0427', complaint: 'No sound' })
    const jobs = useJobsStore()
    await until(() => !!jobs.byId(id), 'the job on the device')
    const w = await mountSuspended(JobsEditForm, { props: { job: jobs.byId(id)! } })
    await w.find('#edit-promised').setValue('2026-12-09')
    await w.find('#edit-priority').setValue('rush')
    await w.find('#edit-complaint').setValue('No sound; fuse blows at switch-on.')
    await w.find('#edit-accessories').setValue('footswitch')
    await w.find('form').trigger('submit')
    await until(() => jobs.byId(id)?.priority === 'rush', 'the edit on the device')
    expect(jobs.byId(id)).toMatchObject({ promisedFor: '2026-12-09', complaint: 'No sound; fuse blows at switch-on.', accessories: 'footswitch' })
    expect(w.emitted('done')).toHaveLength(1)
    const sync = useSyncStore()
    // The pending list is a live query of the outbox: it catches up a moment after the write.
    await until(() => sync.pendingList.some(m => m.name === 'job.setFields'), 'the edit in the outbox list')
    const edits = sync.pendingList.filter(m => m.name === 'job.setFields')
    expect(edits.at(-1)?.args).toMatchObject({ id, fields: { priority: 'rush', promisedFor: '2026-12-09' } })
  })

  it('refuses an empty complaint with the record schema\'s message and changes nothing', async () => {
    await offlineShop('owner')
    const id = await seedJob({ customer: 'Dana Whitlow', amp: 'two-6V6 combo, fixed bias', serial: 'LAW-0419', complaint: 'Hum at idle' })
    const jobs = useJobsStore()
    await until(() => !!jobs.byId(id), 'the job on the device')
    const w = await mountSuspended(JobsEditForm, { props: { job: jobs.byId(id)! } })
    await w.find('#edit-complaint').setValue('   ')
    await w.find('form').trigger('submit')
    await until(() => w.find('#edit-complaint-error').exists(), 'the complaint error')
    expect(w.find('#edit-complaint-error').text()).toBe('say what the customer reports')
    expect(jobs.byId(id)?.complaint).toBe('Hum at idle')
    expect(w.emitted('done')).toBeUndefined()
  })
})
