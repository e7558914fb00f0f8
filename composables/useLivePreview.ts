import type { EvaluateOutputWithFindings } from '#shared/findings/index'
import type { PreviewAnswer, PreviewReply, StoredTeamPack } from '~~/workers/preview'

export type PreviewState = 'idle' | 'computing' | 'ready' | 'invalid'

/** Quiet time after the last keystroke before the engine runs (ms). */
export const PREVIEW_DEBOUNCE_MS = 300

/** Runs previews in a module Web Worker when there is one, else in-process (SSR never calls it). */
type Runner = (seq: number, raw: unknown, packs: StoredTeamPack[]) => Promise<PreviewReply>

function previewRunner(): Runner {
  if (typeof Worker === 'undefined') {
    // Loaded on demand, so the engine stays out of the page bundle when a Worker carries it.
    return async (seq, raw, packs) => ({ seq, ...(await (await import('~~/workers/preview')).computePreview(raw, packs)) })
  }
  const worker = new Worker(new URL('../workers/preview.worker.ts', import.meta.url), { type: 'module' })
  const waiting = new Map<number, (reply: PreviewReply) => void>()
  worker.onmessage = (event: MessageEvent<PreviewReply>) => {
    waiting.get(event.data.seq)?.(event.data)
    waiting.delete(event.data.seq)
  }
  return (seq, raw, packs) => new Promise((resolve) => {
    waiting.set(seq, resolve)
    worker.postMessage({ seq, raw: JSON.parse(JSON.stringify(raw)), packs: JSON.parse(JSON.stringify(packs)) })
  })
}

/**
 * The live analytic comparison: `request(inputs)` debounces, computes off the main thread and
 * keeps only the answer to the newest request. While inputs do not validate, `result` is null and
 * `issues` names the fields, so no stale numbers stay on screen.
 */
export function useLivePreview(debounceMs = PREVIEW_DEBOUNCE_MS) {
  const result = shallowRef<EvaluateOutputWithFindings | null>(null)
  const issues = ref<{ path: string, message: string }[]>([])
  const state = ref<PreviewState>('idle')
  let run: Runner | null = null
  /** the team's enabled rule packs, run after the built-in ones as the server runs them */
  let packs: StoredTeamPack[] = []
  let latest = 0
  let timer: ReturnType<typeof setTimeout> | null = null

  function accept(answer: PreviewAnswer) {
    if (answer.ok) {
      result.value = answer.result
      issues.value = []
      state.value = 'ready'
    } else {
      result.value = null
      issues.value = answer.issues
      state.value = 'invalid'
    }
  }

  async function compute(seq: number, raw: unknown) {
    run ??= previewRunner()
    const reply = await run(seq, raw, packs)
    if (reply.seq === latest) accept(reply)
  }

  /** Asks for a preview of these inputs; an older request still running is superseded. */
  function request(raw: unknown) {
    const seq = ++latest
    state.value = 'computing'
    if (timer) clearTimeout(timer)
    timer = setTimeout(() => {
      timer = null
      void compute(seq, raw)
    }, debounceMs)
  }

  /** Shows field errors at once (inputs that cannot even be read), dropping any pending preview. */
  function invalidate(list: { path: string, message: string }[]) {
    latest++
    if (timer) clearTimeout(timer)
    accept({ ok: false, issues: list })
  }

  /**
   * Sets the team packs for the previews that follow. Set once, from the page's own fetch, before
   * the first request: no fetch of its own and no extra preview (a load after mounting once made a
   * quick Save click get lost, commit 6b77d20).
   */
  function setPacks(next: StoredTeamPack[]) {
    packs = next
  }

  return { result, issues, state, request, invalidate, setPacks }
}
