import { describe, expect, it } from 'vitest'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { offlineShop, seedJob, until } from './helpers/jobs'
import SyncConflictList from '~/components/sync/SyncConflictList.vue'

describe('SyncConflictList', () => {
  it('names a job-status conflict by its amp and customer, not as a note', async () => {
    const { sync, user } = await offlineShop('owner')
    const jobId = await seedJob({ customer: 'Dana Whitlow', amp: 'Two-6L6 combo', serial: 'LAW-0419', complaint: 'Drifts after an hour', status: 'on-bench' })
    const now = new Date().toISOString()
    await sync.db!.conflicts.put({
      id: crypto.randomUUID(), shopId: sync.shopId!, version: 9, deleted: false, pending: 0, tableName: 'jobs', rowId: jobId, field: 'status',
      serverValue: 'ready', clientValue: 'on-bench', serverAuthor: crypto.randomUUID(), clientAuthor: user.id, serverChangedAt: now, clientChangedAt: now, status: 'open', note: null,
    })
    const list = await mountSuspended(SyncConflictList)
    await until(() => list.text().includes('Two-6L6 combo'), 'the conflict named by its job')
    expect(list.text()).toContain('Job \'Two-6L6 combo · Dana Whitlow\' · status')
    expect(list.text()).not.toMatch(/note|text changed/i)
  })
})
