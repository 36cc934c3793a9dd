import type { EntityTable } from '#shared/utils/sync/entities'
import { entityOf } from '#shared/utils/sync/entities'
import type { MutationName } from '#shared/utils/sync/protocol'
import type { Tx } from '../db'
import { insertRows } from '../bulk-insert'
import { ENTITY_POLICIES } from './entity-policies'

const MAX_HELD = 250

/** Creates of this table may wait to be inserted with the next ones (see `insertsTogether`). */
export function holdsTogether(table: EntityTable) {
  const policy = ENTITY_POLICIES[table]
  return !!policy.insertsTogether && !policy.after
}

/** The table of a create whose row may wait, or null. */
function mayHold(name: MutationName): EntityTable | null {
  const entity = entityOf(name)
  return entity?.verb === 'create' && holdsTogether(entity.table) ? entity.table : null
}

/**
 * The rows of a run of creates of one table inside a push, written with one multi-row insert.
 * The push writes them before any other kind of mutation applies and at the end, so no check
 * or edit ever looks for a row that is still held.
 */
export class HeldInserts {
  private table: EntityTable | null = null
  private rows: Record<string, unknown>[] = []

  /** May a mutation of this name apply while the rows held now are still unwritten? */
  canWaitFor(name: MutationName) {
    const table = mayHold(name)
    return table !== null && (this.table === null || this.table === table)
  }

  async hold(tx: Tx, table: EntityTable, row: Record<string, unknown>) {
    if (this.table !== table) await this.write(tx)
    this.table = table
    this.rows.push(row)
    if (this.rows.length >= MAX_HELD) await this.write(tx)
  }

  async write(tx: Tx) {
    if (this.table) await insertRows(tx, ENTITY_POLICIES[this.table].table, this.rows)
    this.table = null
    this.rows = []
  }
}
