import { defineStore } from 'pinia'

/** The status timeline the server writes for each job (who moved it, when). */
export const useJobEventsStore = defineStore('jobEvents', () => {
  const rows = useShopTable('jobEvents').list
  const forJob = (jobId: string) => rows.value.filter(e => e.jobId === jobId).sort((a, b) => (a.at < b.at ? -1 : a.at > b.at ? 1 : 0))
  return { forJob }
})
