import { acceptHMRUpdate, defineStore } from 'pinia'
import { maxTrialsFor } from '#shared/core/contract/evaluate'
import type { EvaluateInput, EvaluateOutput } from '#shared/core/contract/evaluate'
import { rankEvaluation } from '#shared/findings/index'
import type { EvaluateOutputWithFindings, Finding } from '#shared/findings/index'
import { DEFAULT_WEIGHTS } from '#shared/findings/weights'
import type { RankingWeights } from '#shared/findings/weights'
import { canonicalJson } from '#shared/utils/revisionDiff'
import type { StoredTeamPack } from '~~/workers/preview'
import { useStudyStore } from './study'

/** Which result the Candidates area shows. */
export type ResultSource = 'live' | 'monte-carlo' | 'saved'

type Inputs = Record<'spec' | 'process' | 'options', Record<string, unknown>>
type FieldIssue = { path: string, message: string }
/** An evaluation as the Candidates area reads it: findings, ranking and recommendation under the study's weights. */
export type ShownResult = EvaluateOutputWithFindings & { recommendedId: string | null, spec: Record<string, unknown>, options: Record<string, unknown> }

/** Re-ranks an output under other weights (no rules run); an output without findings is ranked on none. */
function reranked(out: EvaluateOutput, weights: RankingWeights): ShownResult | null {
  const o = out as Partial<EvaluateOutputWithFindings>
  if (!o.spec || !o.process || !o.options) return null
  const input = { spec: o.spec, process: o.process, options: o.options } as EvaluateInput
  const findings: Finding[] = o.findings ?? []
  const ranked = rankEvaluation(input, out, findings, weights)
  return { ...(out as ShownResult), findings, rulePacks: o.rulePacks ?? [], ...ranked, recommendedId: ranked.recommendation.candidateId }
}

/**
 * The comparison in the study workspace: the live analytic preview (a Web Worker, debounced, newest
 * answer only), the Monte Carlo job on the server, the ranking under the study's weights (kept by
 * the study store, saved with each revision) and which result is shown. `evaluationId` is the finished Monte Carlo job computed for exactly the current inputs
 * (null otherwise): pass it to the study store's `save(note, evaluationId)`.
 */
export const useComparisonStore = defineStore('comparison', () => {
  const preview = useLivePreview()
  const mc = useEvaluationJob()
  const studyId = ref<number | null>(null)
  const inputs = ref<Inputs | null>(null)
  const inputsKey = ref('')
  const saved = shallowRef<EvaluateOutput | null>(null)
  const savedKey = ref<string | null>(null)
  const source = ref<ResultSource>('live')
  // the weights belong to the study record (saved with each revision): the study store holds them
  const study = useStudyStore()
  const weights = computed<RankingWeights>(() => study.weights ?? DEFAULT_WEIGHTS)

  const monteCarloResult = computed(() => mc.result.value)
  const monteCarloCurrent = computed(() => mc.result.value !== null && mc.inputsKey.value === inputsKey.value)
  const evaluationId = computed(() => (monteCarloCurrent.value ? mc.id.value : null))
  // The saved results belong to the inputs as loaded (the study store's snapshot, read the same way as these inputs).
  const savedCurrent = computed(() => saved.value !== null && (savedKey.value === inputsKey.value || study.snapshot === inputsKey.value))
  const trials = computed(() => Number(inputs.value?.options.trials ?? 0))
  const canRunMonteCarlo = computed(() => preview.state.value !== 'invalid' && trials.value > 0 && !mc.running.value)

  const base = computed<EvaluateOutput | null>(() => {
    if (source.value === 'monte-carlo') return mc.result.value
    if (source.value === 'saved') return saved.value
    return preview.result.value
  })
  const shown = computed(() => (base.value ? reranked(base.value, weights.value) : null))

  /** Opens a study's comparison (clears another study's job): on its saved results when it has them, the truth first. */
  function open(id: number, savedResults: EvaluateOutput | null, savedInputs: Inputs | null) {
    if (studyId.value !== id) {
      mc.clear()
      studyId.value = id
      source.value = savedResults ? 'saved' : 'live'
    }
    setSaved(savedResults, savedInputs)
  }

  /** The head revision's results and the inputs they belong to; newly saved results are shown at once. */
  function setSaved(results: EvaluateOutput | null, savedInputs: Inputs | null) {
    const changed = results !== saved.value
    saved.value = results
    savedKey.value = results && savedInputs ? canonicalJson(savedInputs) : null
    if (!results && source.value === 'saved') source.value = 'live'
    // the Monte Carlo run on screen that was just saved is those results already: no switch, no redraw
    if (results && changed && !(source.value === 'monte-carlo' && monteCarloCurrent.value)) source.value = 'saved'
  }

  /** The team's enabled rule packs, run in the live preview as on the server (set once per page, before inputs). */
  function setTeamPacks(packs: StoredTeamPack[]) {
    preview.setPacks(packs)
  }

  /** New inputs: field errors show at once, otherwise a debounced analytic preview runs. */
  function setInputs(next: Inputs, fieldErrors: FieldIssue[] = []) {
    const key = canonicalJson(next)
    if (key === inputsKey.value && preview.state.value !== 'idle' && fieldErrors.length === 0) return
    inputs.value = next
    inputsKey.value = key
    if (fieldErrors.length > 0) preview.invalidate(fieldErrors)
    else preview.request(next)
    if (source.value === 'monte-carlo' && !monteCarloCurrent.value) source.value = 'live'
    if (source.value === 'saved' && !savedCurrent.value) source.value = 'live'
  }

  /** Trials for "run more trials": ×4, up to the engine's cap for this resolution. */
  const moreTrials = computed(() => Math.min(Math.max(trials.value, 250) * 4, maxTrialsFor(Number(inputs.value?.spec.bits ?? 16))))

  /** Starts Monte Carlo on the server for the current inputs, exactly as they will be saved. */
  async function runMonteCarlo() {
    if (!inputs.value || !canRunMonteCarlo.value) return
    await mc.start(inputs.value, inputsKey.value)
  }

  /** Sets the study's ranking weights (the study becomes unsaved until the next revision keeps them). */
  function setWeights(next: RankingWeights) {
    study.setWeights(next)
  }

  function show(next: ResultSource) {
    if (next === 'monte-carlo' && !mc.result.value) return
    if (next === 'saved' && !saved.value) return
    source.value = next
  }

  watch(mc.id, (id) => {
    if (id !== null && monteCarloCurrent.value) source.value = 'monte-carlo'
  })

  return {
    studyId, inputs, inputsKey, saved, source, weights, shown, trials, moreTrials, canRunMonteCarlo,
    previewState: preview.state, previewIssues: preview.issues, previewResult: preview.result,
    job: mc.job, jobRunning: mc.running, jobProgress: mc.progress, jobError: mc.error,
    monteCarloResult, monteCarloCurrent, evaluationId, savedCurrent,
    open, setSaved, setTeamPacks, setInputs, runMonteCarlo, cancelMonteCarlo: mc.cancel, setWeights, show
  }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useComparisonStore, import.meta.hot))
