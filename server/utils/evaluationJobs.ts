import type { EvaluateInput } from '#shared/core/contract/evaluate'
import { ENGINE_VERSION } from '#shared/core/version'
import type { SessionUser } from '#shared/types/auth'
import type { EvaluationJobDto } from '#shared/types/evaluations'

/** Shortest interval between two progress writes of one job (the last task always writes). */
const PROGRESS_EVERY_MS = 250
/** Why a job whose worker or database went away ended (also shown for jobs of a dead instance). */
const INTERRUPTED = 'The evaluation was interrupted (its server stopped or lost the database); run it again'

// Abort handles of the jobs this instance runs (cancel from another instance goes through the row).
const running = new Map<number, AbortController>()

/**
 * Jobs of a user still queued or running whose heartbeat is older than the slot stale period and
 * that this instance does not run: their instance died. They end as failed with the reason.
 */
async function failAbandonedJobs(where: { user_id?: number, id?: number }): Promise<void> {
  const cutoff = new Date(Date.now() - SLOT_STALE_MS)
  await useDb()('evaluations').where(where).whereIn('status', ['queued', 'running']).whereNotIn('id', [0, ...running.keys()])
    .where(q => q.where('heartbeat_at', '<', cutoff).orWhere(r => r.whereNull('heartbeat_at').where('created_at', '<', cutoff)))
    .update({ status: 'failed', error: INTERRUPTED, finished_at: new Date() })
}

/**
 * Inserts a job row holding one of the user's heavy slots (the one cap, server/utils/heavyRequests.ts)
 * and starts it in the pool without waiting; returns the job id.
 */
export async function startEvaluationJob(user: SessionUser, input: EvaluateInput): Promise<number> {
  await failAbandonedJobs({ user_id: user.id })
  if (await heavySlotsInUse(useDb(), user.id) >= heavyLimit()) throw tooManyHeavy()
  const { id, slot } = await writeTransaction(async (trx) => {
    const slot = await claimHeavySlot(trx, user, 'job')
    const [inserted] = await trx('evaluations').insert({
      team_id: user.teamId, user_id: user.id, status: 'queued', tasks_total: evaluationTaskCount(input),
      input: JSON.stringify(input), engine_version: ENGINE_VERSION, heartbeat_at: new Date()
    })
    await trx('heavy_requests').where({ id: slot }).update({ evaluation_id: inserted! })
    return { id: inserted!, slot }
  })
  holdSlot(slot, id)
  void runJob(id, slot, user.teamId, input)
  return id
}

async function runJob(id: number, slot: number, teamId: number, input: EvaluateInput): Promise<void> {
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
    controller.abort() // a failed progress write leaves tasks queued in the pool: drop them
    const reason = isDatabaseUnavailable(error) ? INTERRUPTED : String((error as Error)?.message ?? error).slice(0, 2000)
    // With the database away this waits (in order, before the slot's release) until it is back.
    await writeWhenPossible(() => db('evaluations').where({ id }).whereIn('status', ['queued', 'running']).update({
      status: cancelled ? 'cancelled' : 'failed', error: cancelled ? null : reason, finished_at: new Date()
    }))
  } finally {
    running.delete(id)
    await releaseHeavySlot(slot)
  }
}

/** The job as the API shows it (result only when asked), or null when not this team's. */
export async function readEvaluationJob(teamId: number, id: number, withResult: boolean): Promise<EvaluationJobDto | null> {
  const columns = ['id', 'user_id', 'status', 'tasks_total', 'tasks_done', 'engine_version', 'error', 'created_at', 'heartbeat_at', 'finished_at']
  const read = () => useDb()('evaluations').where({ id, team_id: teamId }).first(withResult ? [...columns, ...EVALUATION_RESULT_COLUMNS] : columns)
  let row = await read()
  if (!row) return null
  const beat = new Date(row.heartbeat_at ?? row.created_at).getTime()
  // a poll writes only when the job looks abandoned (its instance stopped refreshing it)
  if (['queued', 'running'].includes(row.status) && !running.has(id) && Date.now() - beat > SLOT_STALE_MS) {
    await failAbandonedJobs({ id })
    row = await read()
  }
  return {
    id: row.id,
    userId: row.user_id,
    status: row.status,
    progress: { done: row.tasks_done, total: row.tasks_total },
    engineVersion: row.engine_version,
    error: row.error,
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
    // the slot is free at once, whichever instance runs the job
    if (n > 0) await trx('heavy_requests').where({ evaluation_id: id }).delete()
    if (n > 0 && actor) await writeAudit({ teamId, actorId: actor.id, action: 'evaluation_cancelled', targetType: 'evaluation', targetId: id }, trx)
    return n
  })
  running.get(id)?.abort()
  return changed > 0
}
