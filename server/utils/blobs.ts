import { createHash } from 'node:crypto'
import type { BlobType } from '#shared/utils/schemas/blobs'
import { createLocalBlobStore } from './blob-drivers/local'
import { createS3BlobStore } from './blob-drivers/s3'
import type { BlobStore } from './blob-drivers/types'

// Leading bytes of each accepted format.
// Source: PNG (ISO/IEC 15948, section 5.2 "PNG signature"); JPEG (ITU-T T.81, B.1.1.3: SOI marker FFD8,
// then a marker FF..); WebP (RIFF container: "RIFF", 4-byte size, "WEBP", per the WebP container specification).
const PNG = [0x89, 0x50, 0x4E, 0x47, 0x0D, 0x0A, 0x1A, 0x0A]
const JPEG = [0xFF, 0xD8, 0xFF]
const ascii = (buf: Buffer, at: number, text: string) => buf.subarray(at, at + text.length).toString('latin1') === text

/** What the bytes say they are, whatever the request header claimed. */
export function sniffImageType(buf: Buffer): BlobType | null {
  if (PNG.every((b, i) => buf[i] === b)) return 'image/png'
  if (JPEG.every((b, i) => buf[i] === b)) return 'image/jpeg'
  if (buf.length >= 12 && ascii(buf, 0, 'RIFF') && ascii(buf, 8, 'WEBP')) return 'image/webp'
  return null
}

export const sha256OfBody = (buf: Buffer) => createHash('sha256').update(buf).digest('hex')

let store: { key: string, value: BlobStore } | null = null

/**
 * The photo store this server is configured for: the local folder (NUXT_BLOB_DIR) by default,
 * an S3-compatible bucket with NUXT_BLOB_DRIVER=s3 (and NUXT_S3_*), so several app nodes share photos.
 */
export function useBlobStore(): BlobStore {
  const c = useRuntimeConfig()
  const key = JSON.stringify([c.blobDriver, c.blobDir, c.s3Bucket, c.s3Endpoint, c.s3Prefix])
  if (store?.key === key) return store.value
  const driver = String(c.blobDriver || 'local')
  let value: BlobStore
  if (driver === 'local') value = createLocalBlobStore(c.blobDir || '.data/blobs')
  else if (driver === 's3') {
    value = createS3BlobStore({
      bucket: c.s3Bucket, region: c.s3Region, endpoint: c.s3Endpoint, prefix: c.s3Prefix,
      accessKeyId: c.s3AccessKeyId, secretAccessKey: c.s3SecretAccessKey, forcePathStyle: !!c.s3ForcePathStyle,
    })
  }
  else throw new Error(`Unknown photo store "${driver}" (NUXT_BLOB_DRIVER is local or s3).`)
  store = { key, value }
  return value
}
