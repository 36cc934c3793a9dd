import type { Readable } from 'node:stream'
import { GetObjectCommand, HeadObjectCommand, PutObjectCommand, S3Client, S3ServiceException } from '@aws-sdk/client-s3'
import { blobKey, type BlobStore } from './types'

export interface S3BlobOptions {
  bucket: string
  region: string
  /** Empty for AWS itself; the address of any other S3-compatible store. */
  endpoint?: string
  accessKeyId?: string
  secretAccessKey?: string
  /** `http://host/bucket/key` instead of `http://bucket.host/key`; most self-hosted stores want it. */
  forcePathStyle?: boolean
  /** Key prefix inside the bucket, e.g. `blobs/`. */
  prefix?: string
}

const missing = (error: unknown) => error instanceof S3ServiceException
  && (error.$metadata.httpStatusCode === 404 || error.name === 'NotFound' || error.name === 'NoSuchKey')

/** Objects in an S3-compatible bucket, so every app node serves every photo. */
export function createS3BlobStore(o: S3BlobOptions): BlobStore {
  if (!o.bucket) throw new Error('The S3 photo store needs a bucket (NUXT_S3_BUCKET).')
  const client = new S3Client({
    region: o.region || 'us-east-1',
    endpoint: o.endpoint || undefined,
    forcePathStyle: !!o.forcePathStyle,
    credentials: o.accessKeyId ? { accessKeyId: o.accessKeyId, secretAccessKey: o.secretAccessKey ?? '' } : undefined,
    // Checksums only where the API requires them: not every S3-compatible store knows the newer ones.
    requestChecksumCalculation: 'WHEN_REQUIRED',
    responseChecksumValidation: 'WHEN_REQUIRED',
  })
  const Bucket = o.bucket
  const keyOf = (sha256: string) => `${o.prefix ?? ''}${blobKey(sha256)}`

  async function has(sha256: string) {
    try {
      await client.send(new HeadObjectCommand({ Bucket, Key: keyOf(sha256) }))
      return true
    }
    catch (error) {
      if (missing(error)) return false
      throw error
    }
  }

  return {
    driver: 's3',
    has,
    async put(sha256, body, type) {
      if (await has(sha256)) return
      // A concurrent upload of the same hash writes the same bytes: the last write is still this photo.
      await client.send(new PutObjectCommand({ Bucket, Key: keyOf(sha256), Body: body, ContentType: type, ContentLength: body.length }))
    },
    async get(sha256) {
      try {
        const r = await client.send(new GetObjectCommand({ Bucket, Key: keyOf(sha256) }))
        return (r.Body as Readable | undefined) ?? null
      }
      catch (error) {
        if (missing(error)) return null
        throw error
      }
    },
  }
}
