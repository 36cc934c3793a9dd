import type { Ref } from 'vue'
import type { LocalDb, ConflictRow } from '~/utils/sync/local-db'
import type { ConflictContext } from '~/utils/sync/conflict-view'

type Related = NonNullable<ConflictContext['related']>
export interface ConflictSubject { record?: Record<string, unknown>, related: Related }

/** The record a conflict is about, and the amp and customer that name it (for a job or its lines). */
export async function conflictSubject(db: LocalDb, c: Pick<ConflictRow, 'tableName' | 'rowId'>): Promise<ConflictSubject> {
  const record = await db.table(c.tableName).get(c.rowId) as Record<string, unknown> | undefined
  const jobId = c.tableName === 'jobs' ? c.rowId : undefined
  const job = jobId ? record : undefined
  const amp = job?.ampId ? await db.amps.get(String(job.ampId)) : undefined
  const customer = job?.customerId ? await db.customers.get(String(job.customerId)) : undefined
  return { record, related: { amp: amp?.description, customer: customer?.name } }
}

/** One conflict and the record it is about, live from the device. */
export function useConflict(id: Ref<string>) {
  const sync = useSyncStore()
  const conflict = useLiveQuery(() => sync.db?.conflicts.get(id.value), () => [sync.db, id.value], undefined as ConflictRow | undefined)
  const subject = useLiveQuery(
    async (): Promise<ConflictSubject> => (sync.db && conflict.value ? conflictSubject(sync.db, conflict.value) : { related: {} }),
    () => [sync.db, conflict.value?.rowId],
    { related: {} } as ConflictSubject,
  )
  return { conflict, subject }
}

/** Each open conflict's subject, for the list. */
export function useConflictSubjects() {
  const sync = useSyncStore()
  return useLiveQuery(
    async () => {
      const out = new Map<string, ConflictSubject>()
      if (sync.db) for (const c of sync.conflictList) out.set(c.id, await conflictSubject(sync.db, c))
      return out
    },
    () => [sync.db, sync.conflictList.map(c => c.id).join()],
    new Map<string, ConflictSubject>(),
  )
}
