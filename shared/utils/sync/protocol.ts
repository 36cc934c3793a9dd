// The sync wire protocol: push and pull bodies, mutation names and their arguments.
import { z } from 'zod'
import { ENTITY_MUTATIONS } from './entities'
import { id } from '../schemas/records'
import { MAX_PUSH_MUTATIONS } from './wire'

// The constants, tables and answers are plain data in wire.ts (the device's sync engine loads them
// without the schemas below).
export * from './wire'

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

