import { defineStore } from 'pinia'
import type { NoteRow } from '~/utils/sync/local-db'

export interface NoteFields { title: string, body: string }

const newestFirst = (a: { createdAt: string }, b: { createdAt: string }) => (a.createdAt < b.createdAt ? 1 : a.createdAt > b.createdAt ? -1 : 0)

export function matchesText(query: string, ...texts: (string | null | undefined)[]) {
  const q = query.trim().toLowerCase()
  return !q || texts.some(t => t?.toLowerCase().includes(q))
}

/** Free-standing bench notebook notes of the active shop, rendered from the device. */
export const useNotesStore = defineStore('notes', () => {
  const sync = useSyncStore()
  const rows = useLiveQuery(
    () => (sync.db && sync.shopId ? sync.db.notes.where('shopId').equals(sync.shopId).filter(n => n.jobId === null).toArray() : []),
    () => [sync.db, sync.shopId],
    [] as NoteRow[],
  )
  const notes = computed(() => rows.value.filter(n => !n.deleted).sort(newestFirst))

  const search = (query: string) => notes.value.filter(n => matchesText(query, n.title, n.body))
  const byId = (id: string) => rows.value.find(n => n.id === id)

  // Read from the database, not the list: the list may not yet show a change made a moment ago.
  async function required(id: string) {
    const row = await sync.db?.notes.get(id)
    if (!row) throw new Error('That note is not on this device.')
    return row
  }

  async function create(f: NoteFields): Promise<string> {
    const id = crypto.randomUUID()
    const title = f.title.trim()
    await sync.mutate('note.create', { id, jobId: null, body: f.body, ...(title ? { title } : {}) })
    return id
  }

  /** Sends only the fields that changed, based on the version this device last saw. */
  async function edit(id: string, f: NoteFields) {
    const row = await required(id)
    const fields: Partial<NoteFields> = {}
    if (f.title.trim() !== row.title) fields.title = f.title.trim()
    if (f.body !== row.body) fields.body = f.body
    if (!Object.keys(fields).length) return false
    await sync.mutate('note.setFields', { id, fields }, row.version)
    return true
  }

  async function remove(id: string) {
    await sync.mutate('note.delete', { id }, (await required(id)).version)
  }

  async function restore(id: string) {
    await sync.mutate('note.restore', { id }, (await required(id)).version)
  }

  return { notes, search, byId, create, edit, remove, restore }
})
