import { describe, expect, it } from 'vitest'
import { isRetryableDbError, retryOnDeadlock } from '../../../../server/utils/retry'

// Error shapes as mysql2 reports them (code and errno from the MariaDB error list: 1213 is
// ER_LOCK_DEADLOCK, 1062 ER_DUP_ENTRY). The real deadlock is provoked in tests/api/db-retry.spec.ts.
const deadlock = () => Object.assign(new Error('Deadlock found when trying to get lock; try restarting transaction'), { code: 'ER_LOCK_DEADLOCK', errno: 1213 })

describe('retryOnDeadlock', () => {
  it('tells deadlocks from other errors', () => {
    expect(isRetryableDbError(deadlock())).toBe(true)
    expect(isRetryableDbError({ errno: 1213 })).toBe(true)
    expect(isRetryableDbError(Object.assign(new Error('dup'), { code: 'ER_DUP_ENTRY', errno: 1062 }))).toBe(false)
    expect(isRetryableDbError(null)).toBe(false)
  })

  it('returns the first success after deadlocks and stops after the allowed attempts', async () => {
    let calls = 0
    await expect(retryOnDeadlock(async () => {
      calls += 1
      if (calls < 3) throw deadlock()
      return 'done'
    }, { baseDelayMs: 1 })).resolves.toBe('done')
    expect(calls).toBe(3)
    calls = 0
    await expect(retryOnDeadlock(async () => {
      calls += 1
      throw deadlock()
    }, { attempts: 4, baseDelayMs: 1 })).rejects.toMatchObject({ code: 'ER_LOCK_DEADLOCK' })
    expect(calls).toBe(4)
  })
})
