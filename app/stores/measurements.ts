import { defineStore } from 'pinia'
import type { NewMeasurement } from '#shared/types/measurement'

// TODO(offline issue): replace with the Dexie outbox-backed implementation; blocks saving results.
export const useMeasurementsStore = defineStore('measurements', () => {
  async function save(_m: NewMeasurement): Promise<string> {
    throw new Error('Saving measurements arrives with the on-device store.')
  }
  return { save }
})
