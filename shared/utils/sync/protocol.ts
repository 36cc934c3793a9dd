// The sync wire protocol: push and pull bodies, mutation names and their arguments.
import { z } from 'zod'
import { ENTITY_FIELDS, ENTITY_FIXED, ENTITY_PREFIX, INSERT_ONLY, type EntityFields, type EntityTable } from './entities'
import { id } from '../schemas/records'
import { MAX_PUSH_MUTATIONS } from './wire'

// The constants, tables and answers are plain data in wire.ts (the device's sync engine loads them
// without the schemas below).
export * from './wire'

// Each record gets `<prefix>.create`, `.setFields` (with baseVersion, edited field by field),
// `.delete` and `.restore`; an insert-only record (a bench result) has no `.setFields`. Built here,
// not beside the fields, so a screen that checks a form's fields does not build them all.
type Prefix<T extends EntityTable> = (typeof ENTITY_PREFIX)[T]
type InsertOnly = (typeof INSERT_ONLY)[number]

function entityMutations<T extends EntityTable>(table: T) {
  const fields = ENTITY_FIELDS[table] as z.ZodObject
  const prefix = ENTITY_PREFIX[table] as Prefix<T>
  // Required fields are checked after the defaults are merged (see parseEntityCreate).
  const create = fields.partial().extend({ id })
  const editable = fields.omit(Object.fromEntries((ENTITY_FIXED[table] ?? []).map(f => [f, true])) as never).partial()
  return {
    [`${prefix}.create`]: create,
    ...((INSERT_ONLY as readonly EntityTable[]).includes(table) ? {} : { [`${prefix}.setFields`]: z.object({ id, fields: editable.refine((f: object) => Object.keys(f).length > 0, { message: 'change at least one field' }) }) }),
    [`${prefix}.delete`]: z.object({ id }),
    [`${prefix}.restore`]: z.object({ id }),
  } as {
    [K in `${Prefix<T>}.create`]: z.ZodType<{ id: string } & Partial<EntityFields<T>>>
  } & {
    [K in T extends InsertOnly ? never : `${Prefix<T>}.setFields`]: z.ZodType<{ id: string, fields: Partial<EntityFields<T>> }>
  } & {
    [K in `${Prefix<T>}.delete` | `${Prefix<T>}.restore`]: z.ZodType<{ id: string }>
  }
}

export const ENTITY_MUTATIONS = {
  ...entityMutations('customers'),
  ...entityMutations('amps'),
  ...entityMutations('jobs'),
  ...entityMutations('jobParts'),
  ...entityMutations('jobLabour'),
  ...entityMutations('tubeLots'),
  ...entityMutations('stockTubes'),
  ...entityMutations('matchedSets'),
  ...entityMutations('notes'),
  ...entityMutations('measurements'),
  ...entityMutations('procedureGates'),
  ...entityMutations('procedureRuns'),
  ...entityMutations('rigs'),
  ...entityMutations('rigTubeSets'),
  ...entityMutations('rigGigs'),
  ...entityMutations('rigShares'),
  ...entityMutations('rigSuggestions'),
}

export const MUTATION_ARGS = {
  'conflict.resolve': z.object({ id, value: z.unknown() }),
  ...ENTITY_MUTATIONS,
} as const

export type MutationName = keyof typeof MUTATION_ARGS
export const MUTATION_NAMES = Object.keys(MUTATION_ARGS) as MutationName[]
export type MutationArgs<N extends MutationName> = z.infer<(typeof MUTATION_ARGS)[N]>

export const isMutationName = (name: string): name is MutationName => name in MUTATION_ARGS

export const mutationSchema = z.object({
  id: z.number().int().positive(),
  uuid: id,
  name: z.string().min(1).max(64),
  args: z.unknown(),
  baseVersion: z.number().int().nonnegative().optional(),
})
export type Mutation = z.infer<typeof mutationSchema>

export const pushBodySchema = z.object({
  clientId: id,
  shopId: id,
  schemaVersion: z.number().int().positive(),
  mutations: z.array(mutationSchema).max(MAX_PUSH_MUTATIONS),
})
export type PushBody = z.infer<typeof pushBodySchema>

export const pullBodySchema = z.object({
  clientId: id,
  shopId: id,
  schemaVersion: z.number().int().positive(),
  cookie: z.string().max(500).nullable(),
})
export type PullBody = z.infer<typeof pullBodySchema>

