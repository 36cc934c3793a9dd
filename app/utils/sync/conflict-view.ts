// How a stored conflict reads on screen: the question, the two sides, and what choosing each sends.
import type { ConflictRow, NoteRow } from './local-db'

export interface ConflictChoice {
  /** The value sent with conflict.resolve. */
  value: unknown
  /** Keep a deletion: resolving puts the note back, so it is deleted again right after. */
  thenDelete?: boolean
}

export interface ConflictSide {
  key: 'server' | 'client'
  heading: string
  text: string
  authorId: string | null
  at: string | null
  choice: ConflictChoice
}

export interface ConflictView {
  question: string
  fieldLabel: string
  sides: [ConflictSide, ConflictSide]
  /** Whether a merged text makes sense (not for keep-or-delete). */
  mergeable: boolean
  mergeSeed: string
}

const asText = (v: unknown) => (typeof v === 'string' ? v : v == null ? '' : JSON.stringify(v))

export function conflictView(c: ConflictRow, note?: NoteRow): ConflictView {
  const fieldLabel = c.field === 'title' ? 'title' : 'text'
  const serverBase = { key: 'server' as const, authorId: c.serverAuthor, at: c.serverChangedAt }
  const clientBase = { key: 'client' as const, authorId: c.clientAuthor, at: c.clientChangedAt }
  if (c.field === '_delete') {
    const kept = (c.serverValue ?? {}) as { title?: string, body?: string }
    return {
      question: 'One person edited this note while another deleted it.',
      fieldLabel: 'note',
      sides: [
        { ...serverBase, heading: 'Edited', text: [kept.title, kept.body].filter(Boolean).join('\n\n'), choice: { value: false } },
        { ...clientBase, heading: 'Deleted', text: 'Delete the note.', choice: { value: true } },
      ],
      mergeable: false,
      mergeSeed: '',
    }
  }
  const clientText = asText(c.clientValue)
  if (c.serverValue === null) {
    const field = c.field === 'title' ? 'title' : 'body'
    return {
      question: `This note was deleted, then its ${fieldLabel} was changed on another device.`,
      fieldLabel,
      sides: [
        { ...serverBase, heading: 'Deleted', text: 'Keep the note deleted.', choice: { value: note?.[field] ?? '', thenDelete: true } },
        { ...clientBase, heading: 'Edited after', text: clientText, choice: { value: clientText } },
      ],
      mergeable: true,
      mergeSeed: clientText,
    }
  }
  const serverText = asText(c.serverValue)
  return {
    question: `Two people changed this note's ${fieldLabel} at the same time.`,
    fieldLabel,
    sides: [
      { ...serverBase, heading: 'Reached the server first', text: serverText, choice: { value: serverText } },
      { ...clientBase, heading: 'Arrived second', text: clientText, choice: { value: clientText } },
    ],
    mergeable: true,
    mergeSeed: c.field === 'title' ? serverText : `${serverText}\n\n${clientText}`,
  }
}
