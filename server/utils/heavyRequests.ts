import type { Knex } from 'knex'
import type { SessionUser } from '#shared/types/auth'

/**
 * The one per-user cap on heavy work (NUXT_HEAVY_REQUESTS_PER_USER): synchronous evaluations,
 * netlists, solves, bench comparisons, dry runs AND evaluation jobs each hold a row in
 * `heavy_requests` while they run. A row counts while its holder refreshes `heartbeat_at`; one
 * whose instance died or lost the database stops counting after SLOT_STALE_MS (a job's row also
 * stops counting once the job is no longer queued or running).
 */
export const SLOT_STALE_MS = 60_000
const HEARTBEAT_MS = 10_000
const TICK_MS = 1_000

export type HeavyKind = 'evaluate' | 'netlist' | 'dry-run' | 'solve' | 'bench' | 'job'

// Slots this instance holds (→ the evaluation a job slot belongs to), and writes that failed while
// the database was away, replayed in order on every tick until they land.
const held = new Map<number, number | null>()
const pending: (() => Promise<unknown>)[] = []
let timer: ReturnType<typeof setInterval> | null = null
let lastBeat = 0
let ticking = false

export function heavyLimit(): number {
  return Number(useRuntimeConfig().heavyRequestsPerUser)
}

export function tooManyHeavy() {
  const message = `At most ${heavyLimit()} heavy requests (evaluations and evaluation jobs, netlists, solves, bench comparisons, dry runs) may run at once per user; wait for one to finish or cancel a job`
  return createError({ statusCode: 429, statusMessage: 'Too many heavy requests', message, data: { message } })
}

/** Slots of a user that still count. */
export async function heavySlotsInUse(db: Knex | Knex.Transaction, userId: number): Promise<number> {
  const rows = await db('heavy_requests as h').leftJoin('evaluations as e', 'e.id', 'h.evaluation_id')
    .where('h.user_id', userId).where('h.heartbeat_at', '>', new Date(Date.now() - SLOT_STALE_MS))
    .where(q => q.whereNull('h.evaluation_id').orWhereIn('e.status', ['queued', 'running'])).count({ n: '*' })
  return Number(rows[0]?.n ?? 0)
}

/**
 * Claims a slot in the caller's transaction (429 when all are taken); the count and the insert run
 * under a lock on the user's row, so concurrent requests on any instance cannot both take the last.
 * Call `holdSlot` once the transaction has committed.
 */
export async function claimHeavySlot(trx: Knex.Transaction, user: SessionUser, kind: HeavyKind): Promise<number> {
  await trx('users').where({ id: user.id }).forUpdate().first('id')
  if (await heavySlotsInUse(trx, user.id) >= heavyLimit()) throw tooManyHeavy()
  const [id] = await trx('heavy_requests').insert({ user_id: user.id, kind })
  return id!
}

/** Keeps a claimed slot fresh (and the job it belongs to) until `releaseHeavySlot`. */
export function holdSlot(id: number, evaluationId: number | null = null): void {
  held.set(id, evaluationId)
  ensureTimer()
}

export async function releaseHeavySlot(id: number): Promise<void> {
  held.delete(id)
  await writeWhenPossible(() => useDb()('heavy_requests').where({ id }).delete())
}

/** Runs a write now or, when it fails (the database is away), again on every tick until it lands. */
export async function writeWhenPossible(write: () => Promise<unknown>): Promise<void> {
  try {
    if (pending.length) throw new Error('earlier writes are still waiting')
    await write()
  } catch {
    pending.push(write)
    ensureTimer()
  }
}

/** Runs `work` holding one of the user's slots; 429 naming the limit when all are taken. */
export async function withHeavySlot<T>(user: SessionUser, kind: HeavyKind, work: () => Promise<T>): Promise<T> {
  // At the cap: refuse on a plain count, without the lock (a script retrying in a loop would queue on it).
  if (await heavySlotsInUse(useDb(), user.id) >= heavyLimit()) throw tooManyHeavy()
  const slot = await writeTransaction(trx => claimHeavySlot(trx, user, kind))
  holdSlot(slot)
  try {
    return await work()
  } finally {
    await releaseHeavySlot(slot)
  }
}

async function tick(): Promise<void> {
  while (pending.length) {
    try {
      await pending[0]!()
      pending.shift()
    } catch {
      return // still away: keep the order, try again next tick
    }
  }
  if (held.size && Date.now() - lastBeat >= HEARTBEAT_MS) {
    lastBeat = Date.now()
    const now = new Date()
    const jobs = [...held.values()].filter((id): id is number => id !== null)
    await useDb()('heavy_requests').whereIn('id', [...held.keys()]).update({ heartbeat_at: now }).catch(() => undefined)
    if (jobs.length) await useDb()('evaluations').whereIn('id', jobs).where({ status: 'running' }).update({ heartbeat_at: now }).catch(() => undefined)
  }
  if (!held.size && !pending.length && timer) {
    clearInterval(timer)
    timer = null
  }
}

function ensureTimer(): void {
  if (timer) return
  timer = setInterval(() => {
    if (ticking) return
    ticking = true
    tick().finally(() => {
      ticking = false
    })
  }, TICK_MS)
  timer.unref()
}
