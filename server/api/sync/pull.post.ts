import { pullBodySchema } from '#shared/utils/sync/protocol'
import { handlePull } from '../../utils/sync/pull'

export default defineEventHandler(async (event) => {
  await requireUserId(event)
  const body = await validBody(event, pullBodySchema)
  const access = await withRetry(() => requireShopRole(event, body.shopId, undefined, { personal: true }))
  return handlePull(access, body)
})
