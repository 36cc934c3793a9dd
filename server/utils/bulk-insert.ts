import { getTableColumns, getTableName, sql, type Column } from 'drizzle-orm'
import type { MySqlTable } from 'drizzle-orm/mysql-core'
import { escape } from 'mysql2'
import type { Tx } from './db'

/**
 * One multi-row INSERT whose SQL is written here rather than by drizzle's query builder, which
 * inspects every value of every row (a push of 500 notes spent most of its CPU there). Each value
 * still goes through its column's own mapping (JSON, dates) and mysql2's escaping. Rows that name
 * different columns, or leave out a column whose value drizzle would work out, take drizzle's path.
 */
export async function insertRows(tx: Tx, table: MySqlTable, rows: Record<string, unknown>[]) {
  if (!rows.length) return
  const columns = getTableColumns(table) as Record<string, Column>
  const keys = Object.keys(rows[0]!).filter(k => rows[0]![k] !== undefined && columns[k])
  const worksOut = Object.entries(columns).some(([k, c]) => !keys.includes(k) && (c.defaultFn || c.onUpdateFn))
  const sameShape = rows.every(r => Object.keys(r).filter(k => r[k] !== undefined).length === keys.length && keys.every(k => r[k] !== undefined))
  if (worksOut || !sameShape) {
    await tx.insert(table).values(rows as never)
    return
  }
  // Each value escaped on its own: mysql2's format() rescans the whole text for every placeholder.
  const values = rows.map(row => `(${keys.map((k) => {
    const v = row[k]
    return escape((v === null ? null : columns[k]!.mapToDriverValue(v)) as Parameters<typeof escape>[0])
  }).join(', ')})`)
  const names = keys.map(k => `\`${columns[k]!.name}\``).join(', ')
  await tx.execute(sql.raw(`insert into \`${getTableName(table)}\` (${names}) values ${values.join(', ')}`))
}
