/** Photos the shop server accepts, and how large one may be (plain data: the photo queue loads no schema). */
export const BLOB_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const
export type BlobType = (typeof BLOB_TYPES)[number]
export const MAX_BLOB_BYTES = 8 * 1024 * 1024

export const isBlobType = (t: string): t is BlobType => (BLOB_TYPES as readonly string[]).includes(t)
