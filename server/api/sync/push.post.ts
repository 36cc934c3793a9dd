import { pushBodySchema } from '#shared/utils/sync/protocol'
import { handlePush } from '../../utils/sync/push'

export default defineEventHandler(async (event) => {
  await requireUserId(event)
  const body = await validBody(event, pushBodySchema)
  const access = await withRetry(() => requireShopRole(event, body.shopId, undefined, { personal: true }))
  return handlePush(access, body)
})
