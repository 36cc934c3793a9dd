import { useSyncStore } from '~/stores/sync'
import { usePhotosStore } from '~/stores/photos'
import { syncStarted } from '~/utils/sync/started'

/** Loaded on its own (see plugins/sync.client.ts): the engine, Dexie and both queues. */
export function startSync() {
  useSyncStore().start()
  usePhotosStore().start()
  syncStarted.value = true
}
