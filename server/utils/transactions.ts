// How every writer runs: retried on deadlock or certification conflict, the shop's version row locked and bumped once,
// and work that must wait for the commit (e-mail) run after it.
// Imports spelled out (not Nitro's auto-imports) so the demo seed, run by tsx, shares the version lock.
import { AsyncLocalStorage } from 'node:async_hooks'
import { eq } from 'drizzle-orm'
import { createError } from 'h3'
import { tables, useDb, type Tx } from './db'

// 1213 (ER_LOCK_DEADLOCK) is also what a Galera node answers when certification aborts a transaction
// that conflicts with one committed on another node: retrying is the documented remedy.
const RETRYABLE = new Set(['ER_LOCK_DEADLOCK', 'ER_LOCK_WAIT_TIMEOUT'])
// ER_UNKNOWN_COM_ERROR (1047) is a Galera node that is not in the primary component or still joining.
const UNAVAILABLE = new Set(['ECONNREFUSED', 'ECONNRESET', 'PROTOCOL_CONNECTION_LOST', 'ETIMEDOUT', 'ER_CON_COUNT_ERROR', 'EPIPE', 'ENOTFOUND', 'ER_SERVER_SHUTDOWN', 'ER_UNKNOWN_COM_ERROR'])
export const MAX_RETRIES = 6

function code(error: unknown): string | undefined {
  let e = error as { code?: string, cause?: unknown } | undefined
  for (let i = 0; e && i < 5; i++) {
    if (e.code) return e.code
    e = e.cause as typeof e
  }
  return undefined
}

/** mysql2 marks an error on a connection that died under it fatal, often with no code. */
function lostConnection(error: unknown) {
  let e = error as { fatal?: unknown, message?: unknown, cause?: unknown } | undefined
  for (let i = 0; e && i < 5; i++) {
    if (e.fatal === true && typeof e.message === 'string' && /connection/i.test(e.message)) return true
    e = e.cause as typeof e
  }
  return false
}

export const isRetryable = (error: unknown) => RETRYABLE.has(code(error) ?? '')
export const isUnavailable = (error: unknown) => UNAVAILABLE.has(code(error) ?? '') || isRetryable(error) || lostConnection(error)

/** Retries and give-ups since this process started, for operators and the cluster soak. */
export const retryCounts = { retried: 0, gaveUp: 0 }

// Set while a withRetry loop runs, so a transaction inside one is not retried twice over.
const retrying = new AsyncLocalStorage<{ open: boolean }>()

/**
 * Run a transaction, retrying deadlocks and certification conflicts a bounded number of times; a
 * database that is down answers 503 and changes nothing. Every `useDb().transaction` runs through
 * this (db.ts), so a writer needs no wrapper of its own; an explicit one also retries the reads before.
 */
export async function withRetry<T>(fn: () => Promise<T>): Promise<T> {
  if (retrying.getStore()?.open) return fn()
  const scope = { open: true }
  try {
    return await retrying.run(scope, async () => {
      for (let attempt = 0; ; attempt++) {
        try {
          return await fn()
        }
        catch (error) {
          if (isRetryable(error) && attempt < MAX_RETRIES) {
            retryCounts.retried++
            // One line per retry: the cluster soak counts them from the server log.
            console.warn(`[tx-retry] ${code(error)} attempt ${attempt + 1}`)
            await new Promise(r => setTimeout(r, 5 + Math.random() * 20 * (attempt + 1)))
            continue
          }
          if (isRetryable(error)) {
            retryCounts.gaveUp++
            console.warn(`[tx-retry] ${code(error)} gave up after ${attempt + 1} attempts`)
          }
          if (isUnavailable(error)) throw createError({ statusCode: 503, message: 'The shop server cannot reach its database. Your changes stay on the device.' })
          throw error
        }
      }
    })
  }
  finally {
    // Work started inside (after-commit tasks) may outlive the loop and retries on its own.
    scope.open = false
  }
}

/** Run after-commit work without holding up the answer; each task handles its own failure. */
export function runAfterCommit(tasks: (() => Promise<unknown>)[]) {
  for (const task of tasks) {
    task().catch(error => console.error('after-commit task failed:', (error as Error).message))
  }
}

/**
 * Make the shop's version row before a transaction that locks it: INSERT IGNORE on an existing
 * row inside the transaction takes a shared lock, and two of those deadlock on the upgrade.
 */
export async function ensureShopVersionRow(shopId: string) {
  await useDb().insert(tables.shopVersions).ignore().values({ shopId })
}

/**
 * Lock the shop's version row for this transaction and return its version. Every writer takes
 * this lock (a push after its client row), so changes are stamped and synced in commit order.
 */
export async function lockShopVersion(tx: Tx, shopId: string): Promise<number> {
  const lock = () => tx.select({ version: tables.shopVersions.version }).from(tables.shopVersions)
    .where(eq(tables.shopVersions.shopId, shopId)).for('update')
  let [row] = await lock()
  if (!row) {
    await tx.insert(tables.shopVersions).ignore().values({ shopId })
    ;[row] = await lock()
  }
  return row?.version ?? 0
}

/** Move the locked shop version to `version` (the last one this transaction stamped). */
export async function bumpShopVersion(tx: Tx, shopId: string, version: number) {
  await tx.update(tables.shopVersions).set({ version }).where(eq(tables.shopVersions.shopId, shopId))
}

/** Lock, bump and return the next shop version, for a writer that stamps one change. */
export async function nextShopVersion(tx: Tx, shopId: string): Promise<number> {
  const next = (await lockShopVersion(tx, shopId)) + 1
  await bumpShopVersion(tx, shopId, next)
  return next
}
