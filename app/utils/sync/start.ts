import { useSyncStore } from '~/stores/sync'
import { usePhotosStore } from '~/stores/photos'

/** Loaded on its own (see plugins/sync.client.ts): the engine, Dexie and both queues. */
export function startSync() {
  useSyncStore().start()
  usePhotosStore().start()
}
