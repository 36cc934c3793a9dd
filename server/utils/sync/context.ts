import type { MutationArgs, MutationName } from '#shared/utils/sync/protocol'
import type { Role } from '#shared/utils/roles'
import type { Tx } from '../db'

export interface ApplyContext {
  tx: Tx
  shopId: string
  userId: string
  role: Role
  clientId: string
  /** The shop version this mutation stamps on every row it touches. */
  version: number
  mutationUuid: string
  baseVersion?: number
  now: Date
}

export type ApplyOutcome =
  | { status: 'applied' | 'conflict', touched: true, reason?: string }
  | { status: 'rejected', touched: false, reason: string }

export class Rejection extends Error {}

/** Throw inside an apply function to reject the mutation (nothing it wrote is kept). */
export const reject = (reason: string): never => {
  throw new Rejection(reason)
}

export type ApplyTable = { [N in MutationName]: (ctx: ApplyContext, args: MutationArgs<N>) => Promise<ApplyOutcome> }

export const STAFF: readonly Role[] = ['owner', 'tech', 'desk']
export const isStaff = (role: Role) => STAFF.includes(role)
