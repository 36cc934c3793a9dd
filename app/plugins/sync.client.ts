// Starts the on-device store, background sync and the photo queue; the app never waits for them.
export default defineNuxtPlugin(() => {
  useSyncStore().start()
  usePhotosStore().start()
})
