import { Blob as NodeBlob } from 'node:buffer'
import { describe, expect, it } from 'vitest'
import { flushPromises } from '@vue/test-utils'
import { registerEndpoint } from '@nuxt/test-utils/runtime'
import { getRequestHeader, readRawBody, setResponseStatus } from 'h3'
import { fakeSyncServer, signInLocally } from './helpers/device'
import { sha256Hex, usePhotosStore } from '~/stores/photos'
import { useNotesStore } from '~/stores/notes'
import { useSyncStore } from '~/stores/sync'

async function until(check: () => boolean, what: string, tries = 300) {
  for (let i = 0; i < tries; i++) {
    await flushPromises()
    if (check()) return
    await new Promise(r => setTimeout(r, 10))
  }
  throw new Error(`timed out waiting for ${what}`)
}

// Node's Blob: fake-indexeddb stores values with Node's structured clone.
const png = (tail: string) => new NodeBlob([new Uint8Array([0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A]), tail], { type: 'image/png' }) as unknown as Blob

describe('photos store', () => {
  it('names a photo by its SHA-256', async () => {
    // Source: FIPS 180-2, Appendix B.1: SHA-256("abc").
    expect(await sha256Hex(new TextEncoder().encode('abc').buffer as ArrayBuffer)).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad')
  })

  it('keeps a photo pending until the server confirms it, while notes sync past it', async () => {
    const sync = fakeSyncServer()
    signInLocally()
    const store = useSyncStore()
    const photos = usePhotosStore()
    const notes = useNotesStore()
    await until(() => !!store.engine, 'the engine to start')

    const file = png('bench photo of the chassis')
    const sha = await sha256Hex(await file.arrayBuffer())
    const seen: { type?: string, size: number }[] = []
    let answer = 503
    registerEndpoint(`/api/blobs/${sha}`, {
      method: 'PUT',
      handler: async (event) => {
        const body = await readRawBody(event, false)
        seen.push({ type: getRequestHeader(event, 'content-type'), size: body?.length ?? 0 })
        setResponseStatus(event, answer)
        return answer < 300 ? { sha256: sha } : { message: 'not now' }
      },
    })

    expect(await photos.add(file)).toBe(sha)
    await until(() => seen.length === 1, 'the first upload attempt')
    await until(() => photos.rows.length === 1, 'the photo on the device')
    expect(photos.rows[0]).toMatchObject({ sha256: sha, status: 'pending', type: 'image/png', size: file.size })
    expect(seen[0]).toEqual({ type: 'image/png', size: file.size })

    // A note written now goes out through the outbox although the photo is still waiting.
    await notes.create({ title: '', body: 'Photo of the chassis taken.' })
    await until(() => sync.pushes.length === 1 && store.pending === 0, 'the note to sync')
    expect(photos.rows[0]!.status).toBe('pending')

    // Adding the same bytes again does not queue a second copy.
    expect(await photos.add(png('bench photo of the chassis'))).toBe(sha)
    answer = 201
    await photos.drain()
    await until(() => photos.rows[0]?.status === 'uploaded', 'the upload to be confirmed')
    expect(photos.rows).toHaveLength(1)
    expect(photos.waiting).toBe(0)
  })

  it('marks a photo the server will never take as refused, with its reason, and keeps it', async () => {
    fakeSyncServer()
    signInLocally()
    const store = useSyncStore()
    const photos = usePhotosStore()
    await until(() => !!store.engine, 'the engine to start')
    const file = png('x'.repeat(64))
    const sha = await sha256Hex(await file.arrayBuffer())
    registerEndpoint(`/api/blobs/${sha}`, {
      method: 'PUT',
      handler: (event) => {
        setResponseStatus(event, 415)
        return { message: 'Only JPEG, PNG and WebP photos are accepted.' }
      },
    })
    await photos.add(file)
    await until(() => photos.refused.length === 1, 'the refusal')
    expect(photos.refused[0]).toMatchObject({ sha256: sha, reason: 'Only JPEG, PNG and WebP photos are accepted.' })
    await expect(photos.add(new NodeBlob(['GIF89a'], { type: 'image/gif' }) as unknown as Blob)).rejects.toThrow(/JPEG, PNG or WebP/)
  })
})
