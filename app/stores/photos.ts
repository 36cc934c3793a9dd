import { defineStore } from 'pinia'
import { isBlobType, MAX_BLOB_BYTES } from '#shared/utils/blob-types'
import type { BlobRow } from '~/utils/sync/local-db'
import { STORAGE_KEYS } from '~/utils/storage-keys'
import { backoffDelay } from '~/utils/sync/backoff'

export async function sha256Hex(data: ArrayBuffer): Promise<string> {
  const digest = await crypto.subtle.digest('SHA-256', data)
  return [...new Uint8Array(digest)].map(b => b.toString(16).padStart(2, '0')).join('')
}

type Outcome = 'uploaded' | 'retry' | 'wait' | 'refused'

/**
 * Photos, kept on the device until the server confirms them. They upload in their own queue,
 * one at a time, so a large photo never holds back a note in the mutation outbox.
 */
export const usePhotosStore = defineStore('photos', () => {
  const sync = useSyncStore()
  const rows = useLiveQuery(
    () => (sync.db && sync.shopId ? sync.db.blobs.where('shopId').equals(sync.shopId).toArray() : []),
    () => [sync.db, sync.shopId],
    [] as BlobRow[],
  )
  const waiting = computed(() => rows.value.filter(b => b.status === 'pending').length)
  const refused = computed(() => rows.value.filter(b => b.status === 'refused'))
  const urls = new Map<string, string>()
  let running = false
  let attempt = 0
  let timer: ReturnType<typeof setTimeout> | undefined

  /** Keep a photo on this device and queue it; resolves with its sha256 (its name everywhere). */
  async function add(file: Blob): Promise<string> {
    const db = sync.db
    const shopId = sync.shopId
    if (!db || !shopId) throw new Error('Choose a shop first: photos belong to a shop.')
    if (!isBlobType(file.type)) throw new Error('Use a JPEG, PNG or WebP photo.')
    if (file.size > MAX_BLOB_BYTES) throw new Error(`A photo may be at most ${MAX_BLOB_BYTES / 1024 / 1024} MiB.`)
    const sha256 = await sha256Hex(await file.arrayBuffer())
    if (!(await db.blobs.get(sha256))) {
      await db.blobs.put({ sha256, shopId, type: file.type, size: file.size, blob: file, status: 'pending', createdAt: new Date().toISOString() })
    }
    void drain()
    return sha256
  }

  async function uploadOne(row: BlobRow): Promise<Outcome> {
    let status: number
    let message: string
    try {
      // Bytes rather than the Blob itself: the same request everywhere, at most 8 MiB in memory.
      const res = await $fetch.raw<{ message?: string }>(`/api/blobs/${row.sha256}`, {
        method: 'PUT', body: await row.blob.arrayBuffer(), headers: { 'content-type': row.type }, credentials: 'include', ignoreResponseError: true, retry: 0, timeout: 120_000,
      })
      status = res.status
      message = res._data?.message ?? ''
    }
    catch {
      return 'retry'
    }
    if (status === 200 || status === 201) return 'uploaded'
    // Signed out or no shop chosen: the sync store deals with the session; try again later.
    if (status === 401 || status === 409) return 'wait'
    if ([400, 413, 415].includes(status)) {
      await sync.db?.blobs.update(row.sha256, { status: 'refused', reason: message || `refused (${status})` })
      return 'refused'
    }
    return 'retry'
  }

  async function drainOnce() {
    const db = sync.db
    const shopId = sync.shopId
    if (!db || !shopId) return
    for (;;) {
      const next = await db.blobs.where('shopId').equals(shopId).filter(b => b.status === 'pending').first()
      if (!next) return
      const outcome = await uploadOne(next)
      if (outcome === 'uploaded') await db.blobs.update(next.sha256, { status: 'uploaded' })
      if (outcome === 'retry' || outcome === 'wait') {
        attempt++
        clearTimeout(timer)
        timer = setTimeout(() => void drain(), backoffDelay(attempt))
        return
      }
      attempt = 0
    }
  }

  async function drain() {
    if (running || !sync.engine) return
    running = true
    try {
      const locks = typeof navigator !== 'undefined' ? navigator.locks : undefined
      const name = `${STORAGE_KEYS.syncLockPrefix}${sync.engine.userId}-photos`
      if (locks?.request) await locks.request(name, { ifAvailable: true }, async lock => lock && drainOnce())
      else await drainOnce()
    }
    finally {
      running = false
    }
  }

  /** An address to show the photo: the copy on this device if there is one, else the server's. */
  async function urlFor(sha256: string): Promise<string> {
    const cached = urls.get(sha256)
    if (cached) return cached
    const row = await sync.db?.blobs.get(sha256)
    const url = row ? URL.createObjectURL(row.blob) : `/api/blobs/${sha256}`
    urls.set(sha256, url)
    return url
  }

  let started = false
  function start() {
    if (started || !import.meta.client) return
    started = true
    watch(() => [sync.db, sync.shopId], () => void drain(), { immediate: true })
    window.addEventListener('online', () => {
      attempt = 0
      void drain()
    })
  }

  return { rows, waiting, refused, add, drain, urlFor, start }
})
