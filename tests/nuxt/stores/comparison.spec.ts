import { registerEndpoint } from '@nuxt/test-utils/runtime'
import { readBody } from 'h3'
import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it, vi } from 'vitest'
import { evaluateSpec, parseEvaluateInput } from '../../../shared/core/evaluate'
import { applyFindings } from '../../../shared/findings/index'
import { useStudyStore } from '../../../stores/study'
import { useComparisonStore } from '../../../stores/comparison'

// Inputs in the engine contract's units, invented for the test (a 12-bit spec several candidates meet).
const SPEC = { bits: 12, vrefV: 2.5, updateRateHz: 1e3, loadCapacitanceF: 10e-12, loadResistanceOhm: null, inlTargetLsb: 1, dnlTargetLsb: 0.5, yieldTarget: 0.997, monotonicRequired: true, areaBudgetMm2: 0.2, glitchLimitVs: 5e-9, refSourceOhm: 0, powerBudgetW: 50e-3, temperatureK: 300 }
const PROCESS = { sheetOhmPerSq: 300, matchingPctUm: 0.8, matchingConvention: 'pair', unitOhm: 'auto', switchOhm: 80, switchSkewS: 80e-12, switchChargeC: 2e-15, switchAreaUm2: 6, gateAreaUm2: 3, layoutOverhead: 2, minWidthUm: 0.6, minLengthUm: 1.2, twoRConstruction: 'two-units' }
const OPTIONS = { topologies: ['string', 'r2r-voltage', 'segmented', 'two-stage-string'], trials: 200, seed: 7, inlDefinition: 'endpoint', envelopePoints: 64, confidence: 0.95 }
const inputs = (spec: Record<string, unknown> = {}) => ({ spec: { ...SPEC, ...spec }, process: { ...PROCESS }, options: { ...OPTIONS } })

// A stand-in job server: the evaluation is the engine's own Monte Carlo run of what was posted.
const server = { polls: 0, pollsUntilDone: 2, posted: [] as unknown[], deleted: [] as number[], nextId: 40 }
registerEndpoint('/api/evaluations', {
  method: 'POST',
  handler: async (event) => {
    server.posted.push(await readBody(event))
    server.polls = 0
    return { id: ++server.nextId, userId: 1, status: 'queued', progress: { done: 0, total: 4 }, result: null }
  }
})
for (const id of [41, 42, 43]) {
  registerEndpoint(`/api/evaluations/${id}`, {
    method: 'GET',
    handler: async () => {
      server.polls++
      if (server.polls < server.pollsUntilDone) return { id, userId: 1, status: 'running', progress: { done: server.polls, total: 4 }, result: null }
      const input = parseEvaluateInput(server.posted.at(-1))
      return { id, userId: 1, status: 'done', progress: { done: 4, total: 4 }, result: await applyFindings(input, evaluateSpec(input)) }
    }
  })
  registerEndpoint(`/api/evaluations/${id}`, {
    method: 'DELETE',
    handler: () => {
      server.deleted.push(id)
      return { id, userId: 1, status: 'cancelled', progress: { done: 1, total: 4 }, result: null }
    }
  })
}

beforeEach(() => {
  setActivePinia(createPinia())
  localStorage.clear()
  Object.assign(server, { polls: 0, pollsUntilDone: 2, posted: [], deleted: [] })
})

async function livePreview(store: ReturnType<typeof useComparisonStore>) {
  await vi.waitFor(() => expect(store.previewState).toBe('ready'), { timeout: 20_000, interval: 20 })
}

describe('comparison store', () => {
  it('computes the analytic comparison after typing stops, showing computing… meanwhile', async () => {
    const store = useComparisonStore()
    store.open(7, null, null)
    store.setInputs(inputs())
    expect(store.previewState).toBe('computing')
    await livePreview(store)
    const direct = store.shown!.candidates.find(c => c.id === 'string-direct')!
    // A direct resistor string has one unit resistor per code, 2^N (definition of the topology).
    expect(direct.metrics.resistorCount).toBe(2 ** 12)
    // An R-2R ladder of N bits: N legs, N − 1 series elements and one termination (definition).
    expect(store.shown!.candidates.find(c => c.id === 'r2r-voltage')!.metrics.resistorCount).toBe(2 * 12)
    expect(store.shown!.candidates.every(c => c.linearity.monteCarlo === null)).toBe(true)
  })

  it('keeps only the answer to the newest inputs when they change while computing', async () => {
    const store = useComparisonStore()
    store.open(7, null, null)
    store.setInputs(inputs({ bits: 10 }))
    await new Promise(r => setTimeout(r, 350))
    store.setInputs(inputs({ bits: 8 }))
    await livePreview(store)
    await new Promise(r => setTimeout(r, 400))
    expect((store.shown!.spec as { bits: number }).bits).toBe(8)
  })

  it('shows the field errors instead of the last numbers while the inputs do not validate', async () => {
    const store = useComparisonStore()
    store.open(7, null, null)
    store.setInputs(inputs())
    await livePreview(store)
    store.setInputs(inputs(), [{ path: 'spec.vrefV', message: 'must be a voltage in V' }])
    expect(store.previewState).toBe('invalid')
    expect(store.shown).toBeNull()
    expect(store.previewIssues).toEqual([{ path: 'spec.vrefV', message: 'must be a voltage in V' }])
    // The engine's own range check (DNL target below 1 LSB) also reaches the issues.
    store.setInputs(inputs({ dnlTargetLsb: 1.5 }))
    await vi.waitFor(() => expect(store.previewState).toBe('invalid'), { timeout: 20_000 })
    expect(store.previewIssues.map(i => i.path)).toEqual(['spec.dnlTargetLsb'])
  })

  it('runs Monte Carlo for exactly the current inputs and exposes its evaluationId until they change', async () => {
    const store = useComparisonStore()
    store.open(7, null, null)
    store.setInputs(inputs())
    await livePreview(store)
    await store.runMonteCarlo()
    expect(server.posted[0]).toEqual(inputs())
    expect(store.jobRunning).toBe(true)
    await vi.waitFor(() => expect(store.job?.status).toBe('done'), { timeout: 30_000, interval: 50 })
    expect(store.evaluationId).toBe(41)
    expect(store.source).toBe('monte-carlo')
    expect(store.shown!.candidates[0]!.linearity.monteCarlo?.trials).toBe(200)
    store.setInputs(inputs({ inlTargetLsb: 0.75 }))
    expect(store.evaluationId).toBeNull()
    expect(store.source).toBe('live')
    expect(store.monteCarloResult).not.toBeNull()
  })

  it('cancels a running job with DELETE and keeps no evaluationId for it', async () => {
    server.pollsUntilDone = 1000
    const store = useComparisonStore()
    store.open(7, null, null)
    store.setInputs(inputs())
    await livePreview(store)
    await store.runMonteCarlo()
    await vi.waitFor(() => expect(store.job?.status).toBe('running'), { timeout: 5000, interval: 20 })
    await store.cancelMonteCarlo()
    expect(server.deleted).toEqual([store.job!.id])
    expect(store.job?.status).toBe('cancelled')
    expect(store.jobRunning).toBe(false)
    expect(store.evaluationId).toBeNull()
  })

  it('re-ranks with the study weights without re-running rules, and keeps them in the study record (study store)', async () => {
    const store = useComparisonStore()
    store.open(7, null, null)
    store.setInputs(inputs())
    await livePreview(store)
    const findings = store.shown!.findings
    store.setWeights({ area: 1, yieldMargin: 0, glitch: 0, referenceLoad: 0, settlingMargin: 0, power: 0, complexity: 0 })
    // Area alone: the best score is the smallest total area among candidates meeting spec (score definition, shared/findings/ranking.ts).
    const meeting = store.shown!.ranking.candidates.filter(r => r.meetsSpec).map(r => store.shown!.candidates.find(c => c.id === r.candidateId)!)
    const smallest = meeting.reduce((a, b) => ((b.metrics.totalAreaMm2 ?? Infinity) < (a.metrics.totalAreaMm2 ?? Infinity) ? b : a))
    expect(store.shown!.recommendation.candidateId).toBe(smallest.id)
    expect(store.shown!.findings).toBe(findings)
    // the study store holds them: they are saved with the next revision, not in the browser
    expect(useStudyStore().weights.yieldMargin).toBe(0)
    expect(localStorage.length).toBe(0)
  })

  it('opens on saved results, shows newly saved ones at once, and leaves them for the live preview only when the inputs change', async () => {
    // the rule is the product's ("the truth first", issue 12): common practice, no source
    const store = useComparisonStore()
    const input = parseEvaluateInput(inputs())
    const saved = await applyFindings(input, evaluateSpec(input))
    store.open(8, saved, inputs())
    expect(store.source).toBe('saved')
    store.setInputs(inputs())
    expect(store.source).toBe('saved')
    store.setInputs(inputs({ vrefV: 1.8 }))
    expect(store.source).toBe('live')
    const again = await applyFindings(input, evaluateSpec(input))
    store.setSaved(again, inputs())
    expect(store.source).toBe('saved')
  })

  it('runs the team\'s enabled rule packs in the live preview, as the server does', async () => {
    const store = useComparisonStore()
    // a team rule on the engine's own switch count (the rule-pack schema's fields; any string has 2^12 tap switches at 12 bits)
    const pack = { id: 'team-layout-test', name: 'Team layout', rules: [{
      id: 'switches-over-team-limit', severity: 'warn', title: 'More switches than our layout allows',
      explanation: '{metrics.switchCount} switches, over our line of 100.', action: 'Choose a candidate with fewer switches.',
      basis: { handbook: ['§4.6'], metrics: ['switchCount'] }, threshold: { source: 'common-practice', note: 'our layout line' },
      conditions: { all: [{ fact: 'metrics', path: '$.switchCount', operator: 'greaterThan', value: 100 }] }
    }] }
    store.setTeamPacks([{ packId: 'team-layout-test', version: 1, pack }])
    store.open(9, null, null)
    store.setInputs(inputs())
    await livePreview(store)
    const fired = store.shown!.findings.filter(f => f.packId === 'team-layout-test').map(f => f.candidateId)
    expect(fired).toContain('string-direct')
  })
})
