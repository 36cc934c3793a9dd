import { and, eq, isNull } from 'drizzle-orm'
import { blobParamsSchema } from '#shared/utils/schemas/blobs'

/** A photo, for members of a shop that holds it; anyone else gets 404. */
export default defineEventHandler(async (event) => {
  const userId = await requireUserId(event)
  const { sha256 } = await validParams(event, blobParamsSchema)
  const [row] = await useDb().select({ type: tables.blobs.type, size: tables.blobs.size }).from(tables.blobs)
    .innerJoin(tables.memberships, and(eq(tables.memberships.shopId, tables.blobs.shopId), eq(tables.memberships.userId, userId)))
    .innerJoin(tables.shops, eq(tables.shops.id, tables.blobs.shopId))
    .where(and(eq(tables.blobs.sha256, sha256), isNull(tables.shops.deletedAt)))
    .limit(1)
  const stream = row ? await useBlobStore().get(sha256) : null
  if (!row || !stream) throw createError({ statusCode: 404, message: 'Photo not found.' })
  setResponseHeaders(event, {
    'content-type': row.type,
    'content-length': row.size,
    // The address is the content's hash, so it never changes; private because it needs a member.
    'cache-control': 'private, max-age=31536000, immutable',
    'etag': `"${sha256}"`,
    'x-content-type-options': 'nosniff',
  })
  return sendStream(event, stream)
})
