// Every key this app keeps in localStorage or IndexedDB (and the Web Lock it syncs under), in one place.
export const STORAGE_KEYS = {
  me: 'tubewright.me',
  theme: 'tubewright.theme',
  /** Who signed out (or was signed out) with changes still waiting on this device. */
  unsent: 'tubewright.unsent',
  /** IndexedDB: one database per user, `tubewright-<userId>`. */
  localDbPrefix: 'tubewright-',
  /** Web Lock name prefix: one tab per user syncs at a time. */
  syncLockPrefix: 'tubewright-sync-',
} as const
