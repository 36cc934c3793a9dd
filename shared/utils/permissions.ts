// Who may do what, in one table: the sync policies, the REST routes and the screens all read it.
import { ROLES, STAFF_ROLES, type Role } from './roles'

export type Verb = 'read' | 'create' | 'update' | 'remove' | 'pay'

const EVERYONE: readonly Role[] = ROLES
const MEASURING: readonly Role[] = ['owner', 'tech', 'player']
const BENCH: readonly Role[] = ['owner', 'tech']

/**
 * Record x verb -> roles. `remove` also covers restoring. A verb left out is allowed to nobody.
 * `read` says which roles may open the record at all; players are then limited to their own
 * (their linked customer's jobs, their notes), which the queries do.
 */
export const PERMISSIONS = {
  customers: { read: STAFF_ROLES, create: ['owner', 'desk'], update: ['owner', 'desk'], remove: ['owner'] },
  amps: { read: STAFF_ROLES, create: ['owner', 'desk', 'tech'], update: ['owner', 'desk', 'tech'], remove: ['owner'] },
  jobs: { read: EVERYONE, create: ['owner', 'desk'], update: ['owner', 'desk', 'tech'], remove: ['owner'] },
  jobParts: { read: EVERYONE, create: ['owner', 'tech'], update: ['owner', 'tech'], remove: ['owner', 'tech'] },
  jobLabour: { read: EVERYONE, create: ['owner', 'tech'], update: ['owner', 'tech'], remove: ['owner', 'tech'] },
  // Shop tube stock: the bench manages it, the desk reads it, players see none of it.
  tubeLots: { read: STAFF_ROLES, create: BENCH, update: BENCH, remove: BENCH },
  stockTubes: { read: STAFF_ROLES, create: BENCH, update: BENCH, remove: BENCH },
  matchedSets: { read: STAFF_ROLES, create: BENCH, update: BENCH, remove: BENCH },
  notes: { read: EVERYONE, create: EVERYONE, update: EVERYONE, remove: EVERYONE },
  // Insert-only: a saved result is what the bench computed; it can be deleted, never edited.
  measurements: { read: EVERYONE, create: MEASURING, remove: EVERYONE },
  // Insert-only: an acknowledgement is a record of what was ticked, never rewritten.
  procedureGates: { read: EVERYONE, create: MEASURING },
  procedureRuns: { read: EVERYONE, create: MEASURING, update: MEASURING, remove: ['owner'] },
  invoices: { read: EVERYONE, create: ['owner', 'desk'], update: ['owner', 'desk'], pay: ['owner', 'desk', 'player'] },
  tubes: { read: EVERYONE, create: ['owner', 'tech'], update: ['owner', 'tech'], remove: ['owner', 'tech'] },
  shopSettings: { read: EVERYONE, update: ['owner'] },
  members: { read: STAFF_ROLES, update: ['owner'], remove: ['owner'] },
  invitations: { read: ['owner'], create: ['owner'], remove: ['owner'] },
  mail: { read: ['owner'] },
  // A player's own records, in their personal space (where they are the only member, as player).
  rigs: { read: ['player'], create: ['player'], update: ['player'], remove: ['player'] },
  rigTubeSets: { read: ['player'], create: ['player'], update: ['player'], remove: ['player'] },
  rigGigs: { read: ['player'], create: ['player'], update: ['player'], remove: ['player'] },
  rigShares: { read: ['player'], create: ['player'], remove: ['player'] },
  // In the shop: the bench suggests retube thresholds for a rig shared with it; the player reads them.
  rigSuggestions: { read: ['owner', 'tech', 'player'], create: BENCH, remove: BENCH },
} as const satisfies Record<string, Partial<Record<Verb, readonly Role[]>>>

export type RecordKind = keyof typeof PERMISSIONS

/**
 * Roles that may do the verb only to records they made themselves; the other roles in the
 * verb's list may do it to any record of the shop.
 */
export const OWN_ONLY: Partial<Record<RecordKind, Partial<Record<Verb, readonly Role[]>>>> = {
  notes: { update: ['player'], remove: ['player'] },
  measurements: { remove: ['tech', 'desk', 'player'] },
  procedureRuns: { update: ['tech', 'player'] },
}

/** The roles allowed the verb on some record of this kind (the list a route authorises with). */
export function rolesFor(record: RecordKind, verb: Verb): readonly Role[] {
  return (PERMISSIONS[record] as Partial<Record<Verb, readonly Role[]>>)[verb] ?? []
}

/** Whether this role may do it only to its own records. */
export const ownOnly = (role: Role, record: RecordKind, verb: Verb) => !!OWN_ONLY[record]?.[verb]?.includes(role)

/**
 * May this role do the verb to this kind of record? `mine`: the record is the person's own;
 * left out, the answer is for a record someone else made.
 */
export function can(role: Role, record: RecordKind, verb: Verb, opts: { mine?: boolean } = {}): boolean {
  if (!rolesFor(record, verb).includes(role)) return false
  return !!opts.mine || !ownOnly(role, record, verb)
}
