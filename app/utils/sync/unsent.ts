import { STORAGE_KEYS } from '~/utils/storage-keys'

// Kept apart from the sync store so the sign-in page can read it without loading the sync engine.
export interface UnsentHint { userId: string, name: string, email: string, count: number }

export function readUnsentHint(): UnsentHint | null {
  try {
    const raw = localStorage.getItem(STORAGE_KEYS.unsent)
    return raw ? (JSON.parse(raw) as UnsentHint) : null
  }
  catch {
    return null
  }
}
