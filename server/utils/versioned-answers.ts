import { eq, sql } from 'drizzle-orm'

// Built once: every cached read runs it.
const prepareVersionLookup = () => useDb()
  .select({ version: tables.shopVersions.version })
  .from(tables.shopVersions)
  .where(eq(tables.shopVersions.shopId, sql.placeholder('shopId')))
  .limit(1)
  .prepare()
let versionLookup: ReturnType<typeof prepareVersionLookup> | undefined

/** The shop's committed version: every change to its synced records moves it, in the same transaction. */
export async function shopVersionOf(shopId: string): Promise<number> {
  versionLookup ??= prepareVersionLookup()
  const [row] = await versionLookup.execute({ shopId })
  return row?.version ?? 0
}

/**
 * Read answers kept by shop version, as the JSON sent. A shop's version moves with every change
 * to its synced records, so an answer worked out at version V is still true while the shop is at
 * V; a moved version misses and the answer is worked out again. Each server keeps its own (the
 * version comes from the database on every request, so servers sharing a cluster agree). The
 * oldest entries go first once `max` are held.
 */
export class VersionedAnswers {
  private entries = new Map<string, string>()
  constructor(private readonly max = 500) {}

  async answer(shopId: string, key: string, work: () => Promise<unknown>): Promise<string> {
    const version = await shopVersionOf(shopId)
    const k = `${shopId}\u0000${version}\u0000${key}`
    const kept = this.entries.get(k)
    if (kept !== undefined) return kept
    const json = JSON.stringify(await work())
    // A version read before a change committed may keep an answer that already shows it: newer, never older.
    this.entries.set(k, json)
    if (this.entries.size > this.max) this.entries.delete(this.entries.keys().next().value!)
    return json
  }
}
