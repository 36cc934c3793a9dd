import { and, eq } from 'drizzle-orm'
import { blobParamsSchema, isBlobType, MAX_BLOB_BYTES } from '#shared/utils/schemas/blobs'

const tooLarge = () => createError({ statusCode: 413, message: `A photo may be at most ${MAX_BLOB_BYTES / 1024 / 1024} MiB.` })

/** Store a photo under its own sha256 for the active shop; the same bytes again change nothing. */
export default defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event)
  const { sha256 } = await validParams(event, blobParamsSchema)
  const type = (getRequestHeader(event, 'content-type') ?? '').split(';')[0]!.trim().toLowerCase()
  if (!isBlobType(type)) throw createError({ statusCode: 415, message: 'Only JPEG, PNG and WebP photos are accepted.' })
  const declared = getRequestHeader(event, 'content-length')
  if (declared === undefined) throw createError({ statusCode: 411, message: 'Send the photo with its length.' })
  if (Number(declared) > MAX_BLOB_BYTES) throw tooLarge()

  const body = await readRawBody(event, false)
  if (!body?.length) throw createError({ statusCode: 400, message: 'The photo is empty.' })
  if (body.length > MAX_BLOB_BYTES) throw tooLarge()
  if (sniffImageType(body) !== type) throw createError({ statusCode: 415, message: `The file is not a ${type.slice(6).toUpperCase()} image.` })
  if (sha256OfBody(body) !== sha256) throw createError({ statusCode: 400, message: 'The photo does not match its hash: it was damaged on the way. Try again.' })

  const db = useDb()
  const [existing] = await db.select({ size: tables.blobs.size }).from(tables.blobs)
    .where(and(eq(tables.blobs.sha256, sha256), eq(tables.blobs.shopId, access.shopId)))
  if (!existing) {
    await useBlobStore().put(sha256, body, type)
    const [result] = await db.insert(tables.blobs).ignore()
      .values({ sha256, shopId: access.shopId, type, size: body.length, createdBy: access.userId })
    // A concurrent upload of the same photo may have won the insert: that is still one copy.
    if (result.affectedRows === 1) setResponseStatus(event, 201)
  }
  return { sha256, type, size: body.length, stored: !existing }
})
