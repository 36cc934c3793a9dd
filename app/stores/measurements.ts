import { defineStore } from 'pinia'
import { ENGINE_VERSION } from '#shared/utils/bench'
import type { NewMeasurement } from '#shared/types/measurement'
import type { MeasurementRow } from '~/utils/sync/local-db'

const newestFirst = (a: MeasurementRow, b: MeasurementRow) => (a.createdAt < b.createdAt ? 1 : a.createdAt > b.createdAt ? -1 : 0)

/** Saved bench results of the active shop. Saving is local first; the server re-checks each result. */
export const useMeasurementsStore = defineStore('measurements', () => {
  const sync = useSyncStore()
  const rows = useLiveQuery(
    () => (sync.db && sync.shopId ? sync.db.measurements.where('shopId').equals(sync.shopId).toArray() : []),
    () => [sync.db, sync.shopId],
    [] as MeasurementRow[],
  )
  const all = computed(() => rows.value.filter(m => !m.deleted).sort(newestFirst))
  /** Results saved to the notebook itself (not to a job or a rig). */
  const inNotebook = computed(() => all.value.filter(m => m.jobId === null && m.rigId === null))
  const forJob = (jobId: string) => all.value.filter(m => m.jobId === jobId)
  const forRig = (rigId: string) => all.value.filter(m => m.rigId === rigId)

  async function save(m: NewMeasurement): Promise<string> {
    const id = crypto.randomUUID()
    await sync.mutate('measurement.create', {
      id,
      tool: m.tool,
      inputs: m.inputs as Record<string, unknown>,
      outputs: m.outputs as Record<string, unknown>,
      engineVersion: ENGINE_VERSION,
      ...(m.label ? { label: m.label } : {}),
      jobId: m.attach.kind === 'job' ? m.attach.id : null,
      rigId: m.attach.kind === 'rig' ? m.attach.id : null,
    })
    return id
  }

  async function remove(id: string) {
    const row = await sync.db?.measurements.get(id)
    if (!row) throw new Error('That result is not on this device.')
    await sync.mutate('measurement.delete', { id }, row.version)
  }

  return { all, inNotebook, forJob, forRig, save, remove }
})
