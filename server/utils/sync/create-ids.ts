import { inArray } from 'drizzle-orm'
import { entityOf, type EntityTable } from '#shared/utils/sync/entities'
import type { Mutation } from '#shared/utils/sync/protocol'
import type { Tx } from '../db'
import { ENTITY_POLICIES } from './entity-policies'

// Id columns compare without case (the server's collation), so these sets do too.
const key = (id: string) => id.toLowerCase()

/**
 * Which ids a push's creates name are taken, looked up in one query per table rather than one
 * per create. Taken stays taken: nothing inside a push removes a row. Free holds only until a
 * mutation that may write rows other than its own record applies (one run in a savepoint: see
 * needsSavepoint); the table's next create then looks the batch's ids up again.
 */
export class CreateIds {
  private readonly taken = new Map<EntityTable, Set<string>>()
  private readonly free = new Map<EntityTable, Set<string>>()

  private constructor(private readonly wanted: Map<EntityTable, string[]>) {}

  /** For the creates among these mutations (their ids are looked up on first use). */
  static of(mutations: Mutation[]) {
    const wanted = new Map<EntityTable, string[]>()
    for (const m of mutations) {
      const entity = entityOf(m.name)
      const id = (m.args as { id?: unknown } | null)?.id
      if (entity?.verb !== 'create' || typeof id !== 'string') continue
      wanted.set(entity.table, wanted.get(entity.table) ?? []).get(entity.table)!.push(id)
    }
    return new CreateIds(wanted)
  }

  async isTaken(tx: Tx, table: EntityTable, id: string) {
    if (!this.taken.get(table)?.has(key(id)) && !this.free.get(table)?.has(key(id))) await this.lookUp(tx, table, id)
    return this.takenIn(table).has(key(id))
  }

  /** A create of this push applied. */
  created(table: EntityTable, id: string) {
    this.takenIn(table).add(key(id))
  }

  /** A mutation that may have written other rows applied. */
  forgetFree() {
    this.free.clear()
  }

  private async lookUp(tx: Tx, table: EntityTable, id: string) {
    const ids = [...new Set([...(this.wanted.get(table) ?? []), id])]
    const t = ENTITY_POLICIES[table].table
    const rows = await tx.select({ id: t.id }).from(t).where(inArray(t.id, ids))
    const taken = this.takenIn(table)
    for (const r of rows) taken.add(key(r.id as string))
    this.free.set(table, new Set(ids.map(key).filter(k => !taken.has(k))))
  }

  private takenIn(table: EntityTable) {
    let set = this.taken.get(table)
    if (!set) this.taken.set(table, set = new Set())
    return set
  }
}
