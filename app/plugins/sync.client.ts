// Starts the on-device store and background sync; the app never waits for it.
export default defineNuxtPlugin(() => {
  useSyncStore().start()
})
