// What the person sees about sync: four states, each with its own word and shape.
import type { MutationName } from '#shared/utils/sync/protocol'
import { ENTITY_NOUNS, entityOf } from '#shared/utils/sync/entity-names'

export type SyncState = 'local' | 'sending' | 'synced' | 'conflict'
export type ItemSyncState = Exclude<SyncState, 'sending'>

export const SYNC_STATE_WORDS: Record<SyncState, string> = {
  local: 'on this device',
  sending: 'sending',
  synced: 'synced',
  conflict: 'needs a decision',
}

export interface SyncFacts {
  pending: number
  conflicts: number
  sending: boolean
  lastSyncedAt: string | null
}

/** A decision outranks everything; nothing counts as synced before the server has answered once. */
export function syncStateOf(f: SyncFacts): SyncState {
  if (f.conflicts > 0) return 'conflict'
  if (f.sending && f.pending > 0) return 'sending'
  if (f.pending > 0 || !f.lastSyncedAt) return 'local'
  return 'synced'
}

/** One record's state: an open conflict on it, changes not yet confirmed, or the server's copy. */
export function itemSyncState(row: { id: string, version: number, pending: number }, conflictRowIds: ReadonlySet<string>): ItemSyncState {
  if (conflictRowIds.has(row.id)) return 'conflict'
  if (row.pending > 0 || row.version === 0) return 'local'
  return 'synced'
}

const VERB_WORDS = { create: 'added', setFields: 'edited', delete: 'deleted', restore: 'restored' } as const

const CHANGE_NAMES: Partial<Record<MutationName, string>> = {
  'note.create': 'New note',
  'note.setFields': 'Note edited',
  'note.delete': 'Note deleted',
  'note.restore': 'Note restored',
  'measurement.create': 'Bench result saved',
  'measurement.delete': 'Bench result deleted',
  'measurement.restore': 'Bench result restored',
  'conflict.resolve': 'Decision on a conflict',
}

/** A short human line for a queued or refused change. */
export function describeChange(name: MutationName, args: Record<string, unknown>): string {
  const entity = entityOf(name)
  const base = CHANGE_NAMES[name] ?? (entity ? `${ENTITY_NOUNS[entity.table]} ${VERB_WORDS[entity.verb]}` : name)
  const fields = args.fields as { title?: string, body?: string } | undefined
  const text = String(args.title || args.body || fields?.title || fields?.body || '').trim()
  if (!text) return base
  const short = text.length > 40 ? `${text.slice(0, 39)}…` : text
  return `${base}: ${short}`
}

const minute = 60_000
/** "just now", "5 min ago", "3 h ago", then the date and time. */
export function whenText(iso: string | null | undefined, now = new Date()): string {
  if (!iso) return 'never'
  const at = new Date(iso)
  const ago = now.getTime() - at.getTime()
  if (Number.isNaN(ago)) return 'unknown time'
  if (ago < minute && ago > -minute) return 'just now'
  if (ago > 0 && ago < 60 * minute) return `${Math.round(ago / minute)} min ago`
  if (ago > 0 && ago < 12 * 60 * minute) return `${Math.round(ago / (60 * minute))} h ago`
  return at.toLocaleString('en-GB', { day: 'numeric', month: 'short', hour: '2-digit', minute: '2-digit' })
}
