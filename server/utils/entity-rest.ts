import { randomUUID } from 'node:crypto'
import { and, eq, isNull } from 'drizzle-orm'
import type { z } from 'zod'
import { idParams } from '#shared/utils/schemas/records'
import { ENTITY_NOUNS, ENTITY_PREFIX, type EntityTable } from '#shared/utils/sync/entities'
import type { MutationArgs, MutationName } from '#shared/utils/sync/protocol'
import type { ShopAccess } from './authz'
import { applyDirect } from './sync/direct'
import { ENTITY_POLICIES } from './sync/entity-policies'

/** A record as the REST routes show it: the sync bookkeeping (field stamps) left out. */
export function publicRow<R extends { fieldStamps?: unknown }>(row: R): Omit<R, 'fieldStamps'> {
  const { fieldStamps: _stamps, ...rest } = row
  return rest
}

/** A live record of this shop, or 404. */
export async function findEntity(db: Db | Tx, table: EntityTable, shopId: string, id: string) {
  const t = ENTITY_POLICIES[table].table
  const [row] = await db.select().from(t).where(and(eq(t.id, id), eq(t.shopId, shopId), isNull(t.deletedAt))).limit(1)
  if (!row) throw createError({ statusCode: 404, message: `${ENTITY_NOUNS[table]} not found.` })
  return row as Record<string, unknown> & { id: string, fieldStamps: unknown }
}

type Access = Pick<ShopAccess, 'userId' | 'shopId' | 'role'>
const run = (access: Access, table: EntityTable, verb: string, args: unknown) =>
  applyDirect(access, `${ENTITY_PREFIX[table]}.${verb}` as MutationName, args as MutationArgs<MutationName>)

export async function createEntity(access: Access, table: EntityTable, body: { id?: string } & Record<string, unknown>) {
  const id = body.id ?? randomUUID()
  await run(access, table, 'create', { ...body, id })
  return publicRow(await findEntity(useDb(), table, access.shopId, id))
}

export async function patchEntity(access: Access, table: EntityTable, id: string, fields: Record<string, unknown>) {
  // A deleted record answers 404 rather than being edited into a conflict.
  await findEntity(useDb(), table, access.shopId, id)
  await run(access, table, 'setFields', { id, fields })
  return publicRow(await findEntity(useDb(), table, access.shopId, id))
}

export async function deleteEntity(access: Access, table: EntityTable, id: string) {
  await findEntity(useDb(), table, access.shopId, id)
  await run(access, table, 'delete', { id })
  return { id, deleted: true }
}

// The create, patch and delete routes of a synced record: authorised from PERMISSIONS, then
// validated, then applied through the sync path. A route file is one line naming its record.

/** POST /api/<records>: 201 with the new record. */
export const entityCreateRoute = (table: EntityTable, body: z.ZodType<{ id?: string } & Record<string, unknown>>) => defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor(table, 'create'))
  const fields = await validBody(event, body)
  const created = await createEntity(access, table, fields)
  setResponseStatus(event, 201)
  return created
})

/** PATCH /api/<records>/<id>: the record as it now is. */
export const entityPatchRoute = (table: EntityTable, body: z.ZodType<Record<string, unknown>>) => defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor(table, 'update'))
  const { id } = await validParams(event, idParams)
  const fields = await validBody(event, body)
  return patchEntity(access, table, id, fields)
})

/** DELETE /api/<records>/<id>. */
export const entityDeleteRoute = (table: EntityTable) => defineEventHandler(async (event) => {
  const access = await requireActiveShopRole(event, rolesFor(table, 'remove'))
  const { id } = await validParams(event, idParams)
  return deleteEntity(access, table, id)
})

/** `%` and `_` typed by a person are meant literally. */
export const likePattern = (q: string) => `%${q.replace(/[\\%_]/g, c => `\\${c}`)}%`
