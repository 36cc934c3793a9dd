import { z } from 'zod'

export { BLOB_TYPES, MAX_BLOB_BYTES, isBlobType, type BlobType } from '../blob-types'

export const blobParamsSchema = z.object({
  sha256: z.string().regex(/^[0-9a-f]{64}$/, { message: 'sha256 must be 64 lower-case hex digits' }),
})
