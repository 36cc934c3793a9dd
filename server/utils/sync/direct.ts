import { randomUUID } from 'node:crypto'
import { MUTATION_ARGS, type MutationArgs, type MutationName } from '#shared/utils/sync/protocol'
import type { ShopAccess } from '../authz'
import { APPLY } from './apply'
import { Rejection, type ApplyContext, type ApplyOutcome } from './context'

const STATUS = { invalid: 400, forbidden: 403, missing: 404 } as const

/** REST edits are stamped with this client id: they are nobody's device, so they never count as "my own edit". */
export const DIRECT_CLIENT_ID = 'server-direct'

/**
 * One mutation from a REST route, through the same apply code as sync: the shop's version row
 * is locked, the change is stamped with the next version, and no client log is written.
 * It acts on the latest state (there is no baseVersion), so it never records a conflict.
 */
export async function applyDirect<N extends MutationName>(access: Pick<ShopAccess, 'userId' | 'shopId' | 'role'>, name: N, args: MutationArgs<N>): Promise<ApplyOutcome> {
  const parsed = MUTATION_ARGS[name].safeParse(args)
  if (!parsed.success) throw createError({ statusCode: 400, message: zodMessage(parsed.error) })
  const db = useDb()
  let afterCommit: (() => Promise<unknown>)[] = []
  const outcome = await withRetry(async () => {
    await ensureShopVersionRow(access.shopId)
    return db.transaction(async (tx) => {
      afterCommit = []
      const current = await lockShopVersion(tx, access.shopId)
      const ctx: ApplyContext = {
        tx, shopId: access.shopId, userId: access.userId, role: access.role, clientId: DIRECT_CLIENT_ID,
        version: current + 1, mutationUuid: randomUUID(), baseVersion: current, now: new Date(), afterCommit,
      }
      const apply = APPLY[name] as (ctx: ApplyContext, a: unknown) => Promise<ApplyOutcome>
      try {
        const result = await apply(ctx, parsed.data)
        if (result.touched) await bumpShopVersion(tx, access.shopId, current + 1)
        return result
      }
      catch (error) {
        if (error instanceof Rejection) throw createError({ statusCode: STATUS[error.kind], message: sentence(error.message) })
        throw error
      }
    })
  })
  runAfterCommit(afterCommit)
  return outcome
}

const sentence = (s: string) => s.charAt(0).toUpperCase() + s.slice(1) + (/[.!?]$/.test(s) ? '' : '.')
