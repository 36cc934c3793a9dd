import { defineStore } from 'pinia'
import type { EntityFields } from '#shared/utils/sync/entities'
import { validateCreate } from '~/utils/jobs/check-in'

/** Labour booked on jobs (minutes at an hourly rate in cents), on the device. */
export const useJobLabourStore = defineStore('jobLabour', () => {
  const sync = useSyncStore()
  const rows = useShopTable('jobLabour').list
  const forJob = (jobId: string) => rows.value.filter(l => l.jobId === jobId).sort((a, b) => (a.createdAt < b.createdAt ? -1 : 1))

  async function add(fields: Partial<EntityFields<'jobLabour'>>) {
    const v = validateCreate('jobLabour', fields)
    if (!v.ok) throw new Error(Object.values(v.errors)[0])
    const id = crypto.randomUUID()
    await sync.mutate('jobLabour.create', { id, ...v.value })
    return id
  }

  async function remove(id: string) {
    const row = await sync.db?.jobLabour.get(id)
    if (!row) throw new Error('That labour line is not on this device.')
    await sync.mutate('jobLabour.delete', { id }, row.version)
  }

  return { forJob, add, remove }
})
