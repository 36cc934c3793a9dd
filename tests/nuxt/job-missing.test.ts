import { describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import JobPage from '~/pages/jobs/[id]/index.vue'
import { fakeSyncServer, signInLocally, until } from './helpers/device'
import { useSyncStore } from '~/stores/sync'
import { useJobsStore } from '~/stores/jobs'

describe('a job link for a job not on this device', () => {
  it('says it is fetching while the first sync runs, then says plainly that there is no job you can see', async () => {
    const server = fakeSyncServer()
    // The server is busy (503): the first pull has not come back yet.
    server.mode = 'down'
    signInLocally('tech')
    const sync = useSyncStore()
    await until(() => !!sync.engine, 'the engine to start')
    const w = await mountSuspended(JobPage, { route: `/jobs/${crypto.randomUUID()}` })
    await until(() => useJobsStore().loaded && w.find('[data-testid="job-missing"]').exists(), 'the missing-job line')
    expect(w.find('[data-testid="job-missing"]').text()).toContain('Fetching your jobs')
    expect(w.text()).not.toContain('not on this device')

    server.mode = 'up'
    sync.syncNow()
    await until(() => !!sync.lastSyncedAt, 'the first sync to finish')
    await until(() => w.find('[data-testid="job-missing"]').text().includes('no job here that you can see'), 'the plain answer')
  })
})
