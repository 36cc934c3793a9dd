import { isPersonalTable } from '#shared/utils/sync/entity-names'
import type { LocalDb } from '~/utils/sync/local-db'

type ShopTable = 'customers' | 'amps' | 'jobs' | 'jobParts' | 'jobLabour' | 'tubeLots' | 'stockTubes' | 'matchedSets' | 'jobEvents' | 'invoices' | 'notes' | 'measurements' | 'procedureGates' | 'procedureRuns' | 'rigs' | 'rigTubeSets' | 'rigGigs' | 'rigShares' | 'rigSuggestions'
type RowOf<K extends ShopTable> = LocalDb[K] extends import('dexie').Table<infer R, string> ? R : never

/** Every live (not deleted) row of one table in the active shop (rig records: the person's own space), following the device database. */
export function useShopTable<K extends ShopTable>(table: K) {
  const sync = useSyncStore()
  const space = () => (isPersonalTable(table) ? sync.personalId : sync.shopId)
  const rows = useLiveQuery(
    () => {
      const s = space()
      return sync.db && s ? (sync.db[table] as import('dexie').Table<RowOf<K>, string>).where('shopId').equals(s).toArray() : null
    },
    () => [sync.db, space()],
    null as RowOf<K>[] | null,
  )
  const list = computed(() => (rows.value ?? []).filter(r => !(r as { deleted: boolean }).deleted))
  /** False until the device database has answered once (loading, not empty). */
  const loaded = computed(() => rows.value !== null)
  return { list, loaded }
}

/** The fields of `next` that differ from `row` (what a setFields should carry). */
export function changedFields<T extends object>(row: T, next: Partial<T>): Partial<T> {
  const out: Partial<T> = {}
  for (const [k, v] of Object.entries(next) as [keyof T, T[keyof T]][]) {
    if (v !== undefined && JSON.stringify(row[k]) !== JSON.stringify(v)) out[k] = v
  }
  return out
}
