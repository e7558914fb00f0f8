import type { EvaluateOutputWithFindings } from '#shared/findings/index'
import type { EvaluationJobDto } from '#shared/types/evaluations'

/** How often a running job is asked for its progress (ms). */
export const JOB_POLL_MS = 500

const FINISHED = new Set(['done', 'failed', 'cancelled'])

/**
 * One Monte Carlo job on the server at a time: `start(inputs)` posts it, polls its progress until
 * it finishes, `cancel()` deletes it. `result` and `id` belong to the last job that finished
 * `done`; `inputsKey` is the canonical form of the inputs it was computed for.
 */
export function useEvaluationJob(pollMs = JOB_POLL_MS) {
  const job = ref<Omit<EvaluationJobDto, 'result'> | null>(null)
  const result = shallowRef<EvaluateOutputWithFindings | null>(null)
  const id = ref<number | null>(null)
  const inputsKey = ref<string | null>(null)
  const error = ref('')
  let timer: ReturnType<typeof setTimeout> | null = null
  let pendingKey: string | null = null

  const running = computed(() => job.value !== null && !FINISHED.has(job.value.status))
  const progress = computed(() => {
    const p = job.value?.progress
    return p && p.total > 0 ? Math.min(1, p.done / p.total) : 0
  })

  function settle(dto: EvaluationJobDto) {
    const { result: out, ...rest } = dto
    job.value = rest
    if (dto.status === 'done' && out) {
      result.value = out as EvaluateOutputWithFindings
      id.value = dto.id
      inputsKey.value = pendingKey
    }
    if (dto.status === 'failed') error.value = dto.error ?? 'The evaluation failed.'
    if (!FINISHED.has(dto.status)) timer = setTimeout(() => void poll(dto.id), pollMs)
  }

  async function poll(jobId: number) {
    timer = null
    try {
      settle(await $fetch<EvaluationJobDto>(`/api/evaluations/${jobId}`))
    } catch (e) {
      error.value = apiErrorMessage(e)
      if (job.value) job.value = { ...job.value, status: 'failed' }
    }
  }

  /** Starts a job for exactly these inputs (a save can attach it only if they are unchanged). */
  async function start(inputs: object, key: string) {
    if (running.value) return
    error.value = ''
    pendingKey = key
    try {
      settle(await $fetch<EvaluationJobDto>('/api/evaluations', { method: 'POST', body: inputs }))
    } catch (e) {
      error.value = apiErrorMessage(e)
    }
  }

  /** Cancels the running job; the last finished result stays. */
  async function cancel() {
    if (!job.value || !running.value) return
    if (timer) clearTimeout(timer)
    timer = null
    try {
      settle(await $fetch<EvaluationJobDto>(`/api/evaluations/${job.value.id}`, { method: 'DELETE' }))
    } catch (e) {
      error.value = apiErrorMessage(e)
    }
  }

  /** Forgets the job and its result (another study was opened). */
  function clear() {
    if (timer) clearTimeout(timer)
    timer = null
    job.value = null
    result.value = null
    id.value = null
    inputsKey.value = null
    error.value = ''
  }

  return { job, result, id, inputsKey, error, running, progress, start, cancel, clear }
}
