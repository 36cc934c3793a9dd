import type { Ref } from 'vue'
import type { MeasurementRow, NoteRow } from '~/utils/sync/local-db'
import { summarize, toolName } from '~/utils/notebook/measurement-summary'
import { matchesText } from '~/stores/notes'

export type NotebookItem =
  | { kind: 'note', id: string, at: string, note: NoteRow }
  | { kind: 'measurement', id: string, at: string, measurement: MeasurementRow }

/** Notes and saved results of the notebook in one list, newest first, filtered by `query`. */
export function useNotebook(query: Ref<string>) {
  const notes = useNotesStore()
  const measurements = useMeasurementsStore()
  const items = computed<NotebookItem[]>(() => {
    const q = query.value
    const fromNotes = notes.search(q).map(note => ({ kind: 'note' as const, id: note.id, at: note.createdAt, note }))
    const fromResults = measurements.inNotebook
      .filter(m => matchesText(q, toolName(m.tool), m.label, summarize(m.tool, m.outputs).headline))
      .map(measurement => ({ kind: 'measurement' as const, id: measurement.id, at: measurement.createdAt, measurement }))
    return [...fromNotes, ...fromResults].sort((a, b) => (a.at < b.at ? 1 : a.at > b.at ? -1 : 0))
  })
  const total = computed(() => notes.notes.length + measurements.inNotebook.length)
  return { items, total }
}
