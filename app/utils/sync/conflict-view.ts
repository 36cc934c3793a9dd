// How a stored conflict reads on screen: the question, the two sides, and what choosing each sends.
import type { ConflictRow } from './local-db'
import { fieldInfo, formatFieldValue, recordTitle, RECORD_NOUNS, type ValueNames } from './record-fields'

export interface ConflictChoice {
  /** The value sent with conflict.resolve. */
  value: unknown
  /** Keep a deletion: resolving puts the record back, so it is deleted again right after. */
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
  /** "Job 'two-6L6 combo · Dana Whitlow' · status" */
  title: string
  question: string
  fieldLabel: string
  sides: [ConflictSide, ConflictSide]
  /** Only free-text fields may be merged by hand; enums, numbers and money are picked. */
  mergeable: boolean
  singleLine: boolean
  mergeSeed: string
}

export interface ConflictContext extends ValueNames {
  /** The record as this device has it now. */
  record?: Record<string, unknown>
  related?: { amp?: string, customer?: string }
}

/** The one-line label of a conflict in lists: what it is about and which field. */
export function conflictTitle(c: Pick<ConflictRow, 'tableName' | 'field'>, record?: Record<string, unknown>, related?: ConflictContext['related']) {
  const name = recordTitle(c.tableName, record, related)
  return c.field === '_delete' ? `${name} · edited and deleted` : `${name} · ${fieldInfo(c.tableName, c.field).label}`
}

export function conflictView(c: ConflictRow, ctx: ConflictContext = {}): ConflictView {
  const noun = (RECORD_NOUNS[c.tableName] ?? 'record').toLowerCase()
  const info = fieldInfo(c.tableName, c.field)
  const title = conflictTitle(c, ctx.record, ctx.related)
  const show = (v: unknown) => formatFieldValue(c.tableName, c.field, v, ctx)
  const serverBase = { key: 'server' as const, authorId: c.serverAuthor, at: c.serverChangedAt }
  const clientBase = { key: 'client' as const, authorId: c.clientAuthor, at: c.clientChangedAt }
  const free = info.kind === 'text' || info.kind === 'longtext'
  const base = { title, fieldLabel: info.label, singleLine: info.kind !== 'longtext' }
  if (c.field === '_delete') {
    const kept = (c.serverValue ?? {}) as { title?: string, body?: string }
    return {
      ...base,
      question: `One person edited this ${noun} while another deleted it.`,
      fieldLabel: noun,
      sides: [
        { ...serverBase, heading: 'Edited', text: c.tableName === 'notes' ? [kept.title, kept.body].filter(Boolean).join('\n\n') : `Keep the ${noun} with its changes.`, choice: { value: false } },
        { ...clientBase, heading: 'Deleted', text: `Delete the ${noun}.`, choice: { value: true } },
      ],
      mergeable: false,
      mergeSeed: '',
    }
  }
  const clientText = show(c.clientValue)
  if (c.serverValue === null && c.note === 'edited after it was deleted') {
    return {
      ...base,
      question: `This ${noun} was deleted, then its ${info.label} was changed on another device.`,
      sides: [
        { ...serverBase, heading: 'Deleted', text: `Keep the ${noun} deleted.`, choice: { value: ctx.record?.[c.field] ?? c.clientValue, thenDelete: true } },
        { ...clientBase, heading: 'Edited after', text: clientText, choice: { value: c.clientValue } },
      ],
      mergeable: free,
      mergeSeed: free ? String(c.clientValue ?? '') : '',
    }
  }
  const serverText = show(c.serverValue)
  return {
    ...base,
    question: `Two people changed this ${noun}'s ${info.label} at the same time.`,
    sides: [
      { ...serverBase, heading: 'Reached the server first', text: serverText, choice: { value: c.serverValue } },
      { ...clientBase, heading: 'Arrived second', text: clientText, choice: { value: c.clientValue } },
    ],
    mergeable: free,
    mergeSeed: !free ? '' : info.kind === 'text' ? String(c.serverValue ?? '') : `${String(c.serverValue ?? '')}\n\n${String(c.clientValue ?? '')}`,
  }
}
