import type { Knex } from 'knex'
import type { EvaluateInput } from '#shared/core/contract/evaluate'
import { ENGINE_VERSION } from '#shared/core/version'
import type { SessionUser } from '#shared/types/auth'
import type { EvaluationJobDto } from '#shared/types/evaluations'

/** Queued or running evaluations one user may have at once; more get 429. */
export const MAX_ACTIVE_JOBS_PER_USER = 2
/** A running job whose worker has not reported for this long is taken as interrupted. */
const STALE_AFTER_MS = 10 * 60 * 1000
/** Shortest interval between two progress writes of one job (the last task always writes). */
const PROGRESS_EVERY_MS = 250

// Abort handles of the jobs this instance runs (cancel from another instance goes through the row).
const running = new Map<number, AbortController>()

/** Queued or running jobs of one user. */
async function activeJobs(db: Knex | Knex.Transaction, userId: number): Promise<number> {
  const rows = await db('evaluations').where({ user_id: userId }).whereIn('status', ['queued', 'running']).count({ n: '*' })
  return Number(rows[0]?.n ?? 0)
}

function tooManyJobs() {
  return createError({ statusCode: 429, statusMessage: 'Too many evaluations running', message: `At most ${MAX_ACTIVE_JOBS_PER_USER} evaluations may run at once per user; wait for one to finish or cancel it` })
}

/** Inserts a job row and starts it in the pool without waiting; returns the job id. */
export async function startEvaluationJob(user: SessionUser, input: EvaluateInput): Promise<number> {
  // Already at the cap: refuse on a plain count, without the transaction and its row lock (a
  // script retrying in a loop would otherwise queue on that lock). Below the cap, the user's row
  // lock serialises the count and the insert, so concurrent requests (on any instance) cannot
  // both pass it.
  if (await activeJobs(useDb(), user.id) >= MAX_ACTIVE_JOBS_PER_USER) throw tooManyJobs()
  const id = await writeTransaction(async (trx) => {
    await trx('users').where({ id: user.id }).forUpdate().first('id')
    if (await activeJobs(trx, user.id) >= MAX_ACTIVE_JOBS_PER_USER) throw tooManyJobs()
    const [inserted] = await trx('evaluations').insert({
      team_id: user.teamId, user_id: user.id, status: 'queued', tasks_total: evaluationTaskCount(input),
      input: JSON.stringify(input), engine_version: ENGINE_VERSION
    })
    return inserted!
  })
  void runJob(id, user.teamId, input)
  return id
}

async function runJob(id: number, teamId: number, input: EvaluateInput): Promise<void> {
  const db = useDb()
  const controller = new AbortController()
  running.set(id, controller)
  let lastProgress = 0
  try {
    await db('evaluations').where({ id }).update({ status: 'running', heartbeat_at: new Date() })
    const resultGz = await evaluateInPoolGzip(input, {
      signal: controller.signal,
      packs: await enabledTeamPacks(teamId),
      onProgress: async ({ done, total }) => {
        // At most one progress write per PROGRESS_EVERY_MS (a 16-bit run has dozens of tasks, and
        // every write is request-thread time): the counter, the heartbeat and, in the same
        // statement, the cancel check (a cancelled row is no longer 'running', so nothing changes).
        const now = Date.now()
        if (done < total && now - lastProgress < PROGRESS_EVERY_MS) return
        lastProgress = now
        // Progress writes can land out of order: never move the counter backwards.
        const changed = await db('evaluations').where({ id, status: 'running' }).where('tasks_done', '<', done).update({ tasks_done: done, heartbeat_at: new Date() })
        if (changed === 0 && (await db('evaluations').where({ id }).first('status'))?.status === 'cancelled') controller.abort()
      }
    })
    await db('evaluations').where({ id }).whereNot({ status: 'cancelled' })
      .update({ status: 'done', tasks_done: db.ref('tasks_total'), result_gz: resultGz, finished_at: new Date(), heartbeat_at: new Date() })
  } catch (error) {
    const cancelled = controller.signal.aborted
    await db('evaluations').where({ id }).whereNot({ status: 'cancelled' }).update({
      status: cancelled ? 'cancelled' : 'failed', error: cancelled ? null : String((error as Error)?.message ?? error).slice(0, 2000), finished_at: new Date()
    }).catch(() => undefined)
  } finally {
    running.delete(id)
  }
}

/** The job as the API shows it (result only when asked), or null when not this team's. */
export async function readEvaluationJob(teamId: number, id: number, withResult: boolean): Promise<EvaluationJobDto | null> {
  const columns = ['id', 'user_id', 'status', 'tasks_total', 'tasks_done', 'engine_version', 'error', 'created_at', 'heartbeat_at', 'finished_at']
  const row = await useDb()('evaluations').where({ id, team_id: teamId }).first(withResult ? [...columns, ...EVALUATION_RESULT_COLUMNS] : columns)
  if (!row) return null
  const stale = row.status === 'running' && !running.has(id) && row.heartbeat_at && Date.now() - new Date(row.heartbeat_at).getTime() > STALE_AFTER_MS
  return {
    id: row.id,
    userId: row.user_id,
    status: stale ? 'failed' : row.status,
    progress: { done: row.tasks_done, total: row.tasks_total },
    engineVersion: row.engine_version,
    error: stale ? 'The evaluation was interrupted; run it again' : row.error,
    createdAt: new Date(row.created_at).toISOString(),
    finishedAt: row.finished_at ? new Date(row.finished_at).toISOString() : null,
    result: withResult ? evaluationResultOf(row) : null
  }
}

/** Marks a queued or running job cancelled; the running instance stops at its next task. */
export async function cancelEvaluationJob(teamId: number, id: number, actor?: SessionUser): Promise<boolean> {
  const changed = await useDb().transaction(async (trx) => {
    const n = await trx('evaluations').where({ id, team_id: teamId }).whereIn('status', ['queued', 'running'])
      .update({ status: 'cancelled', finished_at: new Date() })
    if (n > 0 && actor) await writeAudit({ teamId, actorId: actor.id, action: 'evaluation_cancelled', targetType: 'evaluation', targetId: id }, trx)
    return n
  })
  running.get(id)?.abort()
  return changed > 0
}
