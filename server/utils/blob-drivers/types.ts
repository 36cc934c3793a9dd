import type { Readable } from 'node:stream'

/** Where photo bytes live, addressed by their sha256. Every driver is write-once per hash. */
export interface BlobStore {
  readonly driver: 'local' | 's3'
  has: (sha256: string) => Promise<boolean>
  /** Store the bytes; storing a hash that is already there changes nothing. */
  put: (sha256: string, body: Buffer, type: string) => Promise<void>
  /** The bytes as a stream, or null when this hash is not stored. */
  get: (sha256: string) => Promise<Readable | null>
}

/** Two-level layout shared by the drivers: `ab/abcdef...`, so no folder or prefix grows too large. */
export const blobKey = (sha256: string) => `${sha256.slice(0, 2)}/${sha256}`
