import { defineStore } from 'pinia'
import type { EntityFields } from '#shared/utils/sync/entities'
import { validateCreate } from '~/utils/jobs/check-in'

/** Parts fitted on jobs (tubes included), on the device. */
export const useJobPartsStore = defineStore('jobParts', () => {
  const sync = useSyncStore()
  const rows = useShopTable('jobParts').list
  const forJob = (jobId: string) => rows.value.filter(p => p.jobId === jobId).sort((a, b) => (a.createdAt < b.createdAt ? -1 : 1))

  async function add(fields: Partial<EntityFields<'jobParts'>>) {
    const v = validateCreate('jobParts', fields)
    if (!v.ok) throw new Error(Object.values(v.errors)[0])
    const id = crypto.randomUUID()
    await sync.mutate('jobPart.create', { id, ...v.value })
    return id
  }

  async function remove(id: string) {
    const row = await sync.db?.jobParts.get(id)
    if (!row) throw new Error('That part is not on this device.')
    await sync.mutate('jobPart.delete', { id }, row.version)
  }

  return { forJob, add, remove }
})
