import type { MutationArgs, MutationName } from '#shared/utils/sync/protocol'
import { STAFF_ROLES, type Role } from '#shared/utils/roles'
import type { Tx } from '../db'
import type { CreateIds } from './create-ids'
import type { HeldInserts } from './held-inserts'

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
  /** Work to do once the transaction has committed (e-mail); dropped if the mutation is rejected. */
  afterCommit: (() => Promise<unknown>)[]
  /** A push's creates, whose ids it looks up together (a REST edit looks its one id up itself). */
  createIds?: CreateIds
  /** A push's run of creates of one table, inserted together (a REST edit inserts at once). */
  held?: HeldInserts
}

export type ApplyOutcome =
  | { status: 'applied' | 'conflict', touched: true, reason?: string }
  | { status: 'rejected', touched: false, reason: string }

/** Why a mutation was refused: REST answers 400, 403 or 404 from it; sync logs the reason. */
export type RejectionKind = 'invalid' | 'forbidden' | 'missing'

export class Rejection extends Error {
  constructor(message: string, readonly kind: RejectionKind = 'invalid') {
    super(message)
  }
}

/** Throw inside an apply function to reject the mutation (nothing it wrote is kept). */
export const reject = (reason: string, kind: RejectionKind = 'invalid'): never => {
  throw new Rejection(reason, kind)
}

export type ApplyTable = { [N in MutationName]: (ctx: ApplyContext, args: MutationArgs<N>) => Promise<ApplyOutcome> }

export const isStaff = (role: Role) => STAFF_ROLES.includes(role)
