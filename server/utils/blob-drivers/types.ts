import type { Readable } from 'node:stream'
import { createError } from 'h3'

/** Where photo bytes live, addressed by their sha256. Every driver is write-once per hash. */
export interface BlobStore {
  readonly driver: 'local' | 's3'
  has: (sha256: string) => Promise<boolean>
  /** Store the bytes; storing a hash that is already there changes nothing. */
  put: (sha256: string, body: Buffer, type: string) => Promise<void>
  /** The bytes as a stream, or null when this hash is not stored. */
  get: (sha256: string) => Promise<Readable | null>
}

const SHA256_HEX = /^[0-9a-f]{64}$/

/**
 * Two-level layout shared by the drivers: `ab/abcdef...`, so no folder or prefix grows too large.
 * Only a sha256 name is ever turned into a key, so nothing lands outside the blob folder or prefix.
 */
export function blobKey(sha256: string) {
  if (!SHA256_HEX.test(sha256)) throw createError({ statusCode: 400, message: 'sha256 must be 64 lower-case hex digits' })
  return `${sha256.slice(0, 2)}/${sha256}`
}
