import type { SessionUser } from '#shared/types/auth'

/** A heavy request still running after this long no longer counts (its instance likely died). */
const STALE_AFTER_MS = 10 * 60 * 1000

export type HeavyKind = 'evaluate' | 'netlist' | 'dry-run'

/**
 * Runs `work` holding one of the user's heavy-request slots (NUXT_HEAVY_REQUESTS_PER_USER, shared
 * through MariaDB so it holds across instances); 429 naming the limit when all are taken. The
 * count and the claim happen under a lock on the user's row, so concurrent requests cannot both
 * take the last slot.
 */
export async function withHeavySlot<T>(user: SessionUser, kind: HeavyKind, work: () => Promise<T>): Promise<T> {
  const limit = Number(useRuntimeConfig().heavyRequestsPerUser)
  const db = useDb()
  const slot = await db.transaction(async (trx) => {
    await trx('users').where({ id: user.id }).forUpdate().first('id')
    const rows = await trx('heavy_requests').where({ user_id: user.id }).where('started_at', '>', new Date(Date.now() - STALE_AFTER_MS)).count({ n: '*' })
    if (Number(rows[0]?.n ?? 0) >= limit) {
      const message = `At most ${limit} evaluations, netlists or dry runs may run at once per user; wait for one to finish`
      throw createError({ statusCode: 429, statusMessage: 'Too many heavy requests', message, data: { message } })
    }
    const [id] = await trx('heavy_requests').insert({ user_id: user.id, kind })
    return id!
  })
  try {
    return await work()
  } finally {
    await db('heavy_requests').where({ id: slot }).delete().catch(() => undefined)
  }
}
