// Every key this app keeps in localStorage or IndexedDB, in one place.
export const STORAGE_KEYS = {
  me: 'tubewright.me',
  theme: 'tubewright.theme',
} as const
