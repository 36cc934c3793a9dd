import type { Ref } from 'vue'
import type { ConflictRow, NoteRow } from '~/utils/sync/local-db'

/** One conflict and the note it is about, live from the device. */
export function useConflict(id: Ref<string>) {
  const sync = useSyncStore()
  const conflict = useLiveQuery(() => sync.db?.conflicts.get(id.value), () => [sync.db, id.value], undefined as ConflictRow | undefined)
  const note = useLiveQuery(
    () => (conflict.value?.tableName === 'notes' ? sync.db?.notes.get(conflict.value.rowId) : undefined),
    () => [sync.db, conflict.value?.rowId],
    undefined as NoteRow | undefined,
  )
  return { conflict, note }
}
