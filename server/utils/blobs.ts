import { createHash, randomUUID } from 'node:crypto'
import { existsSync } from 'node:fs'
import { mkdir, rename, writeFile } from 'node:fs/promises'
import { dirname, join, resolve } from 'node:path'
import type { BlobType } from '#shared/utils/schemas/blobs'

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

const SHA256_HEX = /^[0-9a-f]{64}$/

/** Where a blob lives; only a sha256 name is ever turned into a path, so nothing lands outside the blob folder. */
export function blobPath(sha256: string) {
  if (!SHA256_HEX.test(sha256)) throw createError({ statusCode: 400, message: 'sha256 must be 64 lower-case hex digits' })
  return join(resolve(useRuntimeConfig().blobDir || '.data/blobs'), sha256.slice(0, 2), sha256)
}

/** Write once: the name is the content's hash, so an existing file already holds these bytes. */
export async function storeBlobFile(sha256: string, body: Buffer) {
  const path = blobPath(sha256)
  if (existsSync(path)) return path
  await mkdir(dirname(path), { recursive: true })
  const tmp = `${path}.${randomUUID()}.tmp`
  await writeFile(tmp, body)
  await rename(tmp, path)
  return path
}
