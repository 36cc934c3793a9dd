import { ref } from 'vue'

/** Set once the sync engine has loaded and started (plugins/sync.client.ts); the sync chip and notices wait for it. */
export const syncStarted = ref(false)
