import { beforeEach, describe, expect, it } from 'vitest'
import type { VueWrapper } from '@vue/test-utils'
import { mountSuspended } from '@nuxt/test-utils/runtime'
import { JobsStatusMoves } from '#components'
import { JOB_TRANSITIONS } from '#shared/utils/jobs/states'
import { offlineShop, seedJob, until } from './helpers/jobs'
import { useJobsStore } from '~/stores/jobs'
import { SHOP_ID } from './helpers/device'

beforeEach(() => {
  localStorage.clear()
  useSessionStore().me = null
})

const offered = (w: VueWrapper) => w.findAll('[data-move]').map(b => b.attributes('data-move'))

describe('status moves', () => {
  it('offers only the moves allowed from the current state, and a move goes to the outbox', async () => {
    const { sync } = await offlineShop('tech')
    const id = await seedJob({ customer: 'Dana Whitlow', amp: 'two-6V6 combo, fixed bias', serial: 'LW-6V6-0142', complaint: 'Hum at idle' })
    const jobs = useJobsStore()
    await until(() => !!jobs.byId(id), 'the job')
    const w = await mountSuspended(JobsStatusMoves, { props: { job: jobs.byId(id)! } })
    // Source: the status flow in shared/utils/jobs/states.ts (checked-in → on-bench or cancelled).
    expect(offered(w)).toEqual(['on-bench', 'cancelled'])
    expect(offered(w)).not.toContain('ready')

    await w.find('[data-move="on-bench"]').trigger('click')
    await until(() => jobs.byId(id)?.status === 'on-bench', 'the job on the bench')
    await w.setProps({ job: jobs.byId(id)! })
    expect(offered(w)).toEqual([...JOB_TRANSITIONS['on-bench']])
    const last = (await sync.db!.outbox.where('shopId').equals(SHOP_ID).sortBy('id')).at(-1)
    expect(last).toMatchObject({ name: 'job.setFields', args: { id, fields: { status: 'on-bench' } }, baseVersion: 0 })
  })

  it('a closed job offers nothing, and a player sees no moves', async () => {
    await offlineShop('owner')
    const id = await seedJob({ customer: 'Sam Okafor', amp: '100 W four-6L6 head', serial: 'SO-6L6-7731', complaint: 'Crackles', status: 'handed-back' })
    const jobs = useJobsStore()
    await until(() => jobs.byId(id)?.status === 'handed-back', 'the job handed back')
    await jobs.move(id, 'closed')
    await until(() => jobs.byId(id)?.status === 'closed', 'the job closed')
    const closed = await mountSuspended(JobsStatusMoves, { props: { job: jobs.byId(id)! } })
    expect(offered(closed)).toEqual([])
    await expect(jobs.move(id, 'on-bench')).rejects.toThrow(/cannot go/)

    const { role } = useSessionStore()
    expect(role).toBe('owner')
    useSessionStore().me!.activeShop!.role = 'player'
    const ready = { ...jobs.byId(id)!, status: 'ready' as const }
    const asPlayer = await mountSuspended(JobsStatusMoves, { props: { job: ready } })
    expect(offered(asPlayer)).toEqual([])
  })
})
