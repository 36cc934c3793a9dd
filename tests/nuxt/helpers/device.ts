// An on-device database for Nuxt-environment tests: fake-indexeddb under Dexie, and a fake shop server.
import 'fake-indexeddb/auto'
import Dexie from 'dexie'
import { registerEndpoint } from '@nuxt/test-utils/runtime'
import { readBody, setResponseStatus } from 'h3'
import type { PullReply, PushBody, RowChange } from '#shared/utils/sync/protocol'
import { flushPromises } from '@vue/test-utils'
import { useSessionStore } from '~/stores/session'
import { startSync } from '~/utils/sync/start'

// Dexie read its dependencies when the app loaded, before fake-indexeddb existed.
Dexie.dependencies.indexedDB = indexedDB
Dexie.dependencies.IDBKeyRange = IDBKeyRange

export const SHOP_ID = '6f1c2a10-0000-4000-8000-00000000a001'

/** Sign in on the device only (as a cached session would be), with a fresh user id and database. */
export function signInLocally(role: 'tech' | 'owner' | 'player' = 'tech', user = { id: crypto.randomUUID(), name: 'Owen Pryde', email: 'tech@larkspur.example' }) {
  // The app starts sync once its first page is on screen (plugins/sync.client.ts); here there is
  // no page, so start it here, before the user arrives, as the app did before the page.
  startSync()
  useSessionStore().me = {
    user,
    memberships: [{ shopId: SHOP_ID, shopName: 'Larkspur Amp Works', role }],
    activeShop: { id: SHOP_ID, name: 'Larkspur Amp Works', role },
  }
  return user
}

export function signOutLocally() {
  useSessionStore().me = null
}

/**
 * A small stand-in for the shop server's sync routes: applies every change, and answers pulls
 * with whatever rows the test puts in `rows`. `mode` makes it fail (with `status`) or hold a push open.
 */
export function fakeSyncServer() {
  const server = {
    mode: 'up' as 'up' | 'down' | 'hold',
    status: 503,
    lmid: 0,
    version: 0,
    pushes: [] as PushBody[],
    rows: [] as RowChange[],
    release: () => {},
  }
  registerEndpoint('/api/sync/push', {
    method: 'POST',
    handler: async (event) => {
      const body = await readBody<PushBody>(event)
      if (server.mode === 'down') {
        setResponseStatus(event, server.status)
        return { message: `The shop server answered ${server.status}.` }
      }
      if (server.mode === 'hold') await new Promise<void>(resolve => (server.release = resolve))
      server.pushes.push(body)
      const fresh = body.mutations.filter(m => m.id > server.lmid)
      server.lmid = Math.max(server.lmid, ...body.mutations.map(m => m.id))
      return { lmid: server.lmid, results: fresh.map(m => ({ id: m.id, status: 'applied' })) }
    },
  })
  registerEndpoint('/api/sync/pull', {
    method: 'POST',
    handler: async (event) => {
      if (server.mode === 'down') {
        setResponseStatus(event, server.status)
        return { message: `The shop server answered ${server.status}.` }
      }
      return { cookie: `v${server.version}`, lmid: server.lmid, reset: false, more: false, changes: server.rows.splice(0) } satisfies PullReply
    },
  })
  return server
}

/** Waits (flushing Vue and timers) until `check` holds, or fails naming `what`. */
export async function until(check: () => boolean, what: string, tries = 200) {
  for (let i = 0; i < tries; i++) {
    await flushPromises()
    if (check()) return
    await new Promise(r => setTimeout(r, 10))
  }
  throw new Error(`timed out waiting for ${what}`)
}
