import { defineStore } from 'pinia'
import type { NoteRow } from '~/utils/sync/local-db'

/** Notes on jobs: internal to the shop, or visible to the customer (and printed on the record). */
export const useJobNotesStore = defineStore('jobNotes', () => {
  const sync = useSyncStore()
  const rows = useShopTable('notes').list
  const forJob = (jobId: string) => rows.value.filter(n => n.jobId === jobId).sort((a, b) => (a.createdAt < b.createdAt ? -1 : 1))
  const customerVisible = (jobId: string) => forJob(jobId).filter(n => n.visibility === 'customer')

  async function add(jobId: string, body: string, visibility: NoteRow['visibility']) {
    const text = body.trim()
    if (!text) throw new Error('Write something first.')
    const id = crypto.randomUUID()
    await sync.mutate('note.create', { id, jobId, body: text, visibility })
    return id
  }

  return { forJob, customerVisible, add }
})
