// Components under test start the on-device store as soon as a user is signed in, so every
// Nuxt-environment test gets an IndexedDB (in memory), as a browser would have.
import 'fake-indexeddb/auto'
import Dexie from 'dexie'
import { afterEach } from 'vitest'

Dexie.dependencies.indexedDB = indexedDB
Dexie.dependencies.IDBKeyRange = IDBKeyRange

// Let work queued against a test's database settle before the next test may close it.
afterEach(async () => {
  await new Promise(r => setTimeout(r, 50))
})
