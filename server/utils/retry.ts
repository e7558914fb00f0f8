/**
 * Retries a whole transaction when the database rolled it back as a deadlock victim
 * (ER_LOCK_DEADLOCK, 1213). On a Galera cluster a certification conflict with a write committed
 * on another node is reported with the same code. The transaction was rolled back entirely, so
 * running it again is safe as long as everything it does happens inside it (mail is queued in the
 * outbox table, never sent from inside a transaction).
 */
export const RETRYABLE_DB_CODES = new Set(['ER_LOCK_DEADLOCK'])
export const RETRYABLE_DB_ERRNOS = new Set([1213])

export interface RetryOptions {
  /** Tries in all, the first included. */
  attempts?: number
  /** Wait before the second try; doubles each time, with up to 50 % random jitter added. */
  baseDelayMs?: number
  /** Called before each retry (for logs and tests). */
  onRetry?: (error: unknown, attempt: number) => void
}

/** True when the error is a deadlock or a Galera certification failure. */
export function isRetryableDbError(error: unknown): boolean {
  if (!error || typeof error !== 'object') return false
  const { code, errno } = error as { code?: string, errno?: number }
  return (code !== undefined && RETRYABLE_DB_CODES.has(code)) || (errno !== undefined && RETRYABLE_DB_ERRNOS.has(errno))
}

/** Runs `run` and runs it again (a bounded number of times) when it fails with a retryable error. */
export async function retryOnDeadlock<T>(run: () => Promise<T>, options: RetryOptions = {}): Promise<T> {
  const attempts = options.attempts ?? 4
  const baseDelayMs = options.baseDelayMs ?? 20
  for (let attempt = 1; ; attempt += 1) {
    try {
      return await run()
    } catch (error) {
      if (attempt >= attempts || !isRetryableDbError(error)) throw error
      options.onRetry?.(error, attempt)
      const wait = baseDelayMs * 2 ** (attempt - 1)
      await new Promise(resolve => setTimeout(resolve, wait + Math.random() * wait * 0.5))
    }
  }
}
