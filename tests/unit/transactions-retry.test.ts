import { describe, expect, it, vi } from 'vitest'
import { MAX_RETRIES, retryCounts, withRetry } from '../../server/utils/transactions'

// What mysql2 throws for MariaDB error 1213, which a Galera node also answers on a certification conflict.
const deadlock = () => Object.assign(new Error('Deadlock found when trying to get lock; try restarting transaction'), { code: 'ER_LOCK_DEADLOCK', errno: 1213 })

describe('withRetry', () => {
  vi.spyOn(console, 'warn').mockImplementation(() => {})

  it('runs a transaction again after a deadlock and counts each retry', async () => {
    const before = retryCounts.retried
    let calls = 0
    const result = await withRetry(async () => {
      calls++
      if (calls < 3) throw deadlock()
      return 'committed'
    })
    expect(result).toBe('committed')
    expect(calls).toBe(3)
    expect(retryCounts.retried - before).toBe(2)
  })

  it('gives up after a bounded number of attempts and answers 503', async () => {
    const gaveUp = retryCounts.gaveUp
    let calls = 0
    await expect(withRetry(async () => {
      calls++
      throw deadlock()
    })).rejects.toMatchObject({ statusCode: 503 })
    expect(calls).toBe(MAX_RETRIES + 1)
    expect(retryCounts.gaveUp - gaveUp).toBe(1)
  })

  it('retries only the outermost loop when one runs inside another', async () => {
    let inner = 0
    await expect(withRetry(() => withRetry(async () => {
      inner++
      throw deadlock()
    }))).rejects.toMatchObject({ statusCode: 503 })
    expect(inner).toBe(MAX_RETRIES + 1)
  })

  it('does not retry other errors', async () => {
    let calls = 0
    await expect(withRetry(async () => {
      calls++
      throw Object.assign(new Error('duplicate'), { code: 'ER_DUP_ENTRY' })
    })).rejects.toThrow('duplicate')
    expect(calls).toBe(1)
  })
})
