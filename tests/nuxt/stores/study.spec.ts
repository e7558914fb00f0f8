import { registerEndpoint } from '@nuxt/test-utils/runtime'
import { createError, readBody } from 'h3'
import { createPinia, setActivePinia } from 'pinia'
import { beforeEach, describe, expect, it } from 'vitest'
import type { RevisionDto } from '../../../shared/types/revisions'
import type { StudyDto } from '../../../shared/types/studies'
import { useStudyStore } from '../../../stores/study'

// Inputs in the engine contract's units, invented for the test.
const SPEC = { bits: 12, vrefV: 2.5, updateRateHz: 1e6, loadCapacitanceF: 10e-12, loadResistanceOhm: null, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.997, monotonicRequired: true, areaBudgetMm2: 0.05, glitchLimitVs: 50e-12, refSourceOhm: 0, powerBudgetW: 1e-3, temperatureK: 300 }
const PROCESS = { sheetOhmPerSq: 300, matchingPctUm: 0.8, matchingConvention: 'pair', unitOhm: 'auto', switchOhm: 80, switchSkewS: 80e-12, switchChargeC: 2e-15, switchAreaUm2: 6, gateAreaUm2: 3, layoutOverhead: 2, minWidthUm: 0.6, minLengthUm: 1.2, twoRConstruction: 'two-units' }
const OPTIONS = { topologies: ['string', 'segmented'], trials: 500, seed: 7, inlDefinition: 'endpoint', envelopePoints: 256, confidence: 0.95 }

const server = { version: 2, spec: { ...SPEC } as Record<string, unknown>, posted: [] as Record<string, unknown>[], refuseWith: 0, weights: null as unknown }

function revision(number: number, spec = server.spec, weights: unknown = server.weights): RevisionDto {
  return { number, studyId: 7, engineVersion: 'test', hasResults: false, note: null, author: { id: 1, name: 'Test' }, createdAt: new Date(0).toISOString(), spec, process: PROCESS, options: OPTIONS, evaluationId: null, results: null, weights } as unknown as RevisionDto
}
const study = (): StudyDto => ({ id: 7, title: 'Store test', blockName: null, status: 'draft', spec: server.spec, version: server.version, owner: { id: 1, name: 'Test' }, createdAt: '', updatedAt: '' } as unknown as StudyDto)

registerEndpoint('/api/studies/7', () => study())
registerEndpoint('/api/studies/7/revisions/2', () => revision(2, SPEC, server.weights))
registerEndpoint('/api/studies/7/revisions/3', () => revision(3))
registerEndpoint('/api/studies/7/revisions', {
  method: 'POST',
  handler: async (event) => {
    const body = await readBody(event)
    server.posted.push(body)
    if (server.refuseWith) throw createError({ statusCode: 409, statusMessage: 'Conflict', data: { message: 'baseVersion: stale', currentVersion: server.refuseWith } })
    server.version += 1
    server.spec = body.spec
    server.weights = body.weights ?? null
    return revision(server.version, body.spec, body.weights)
  }
})

beforeEach(() => {
  setActivePinia(createPinia())
  Object.assign(server, { version: 2, spec: { ...SPEC }, posted: [], refuseWith: 0, weights: null })
})

describe('study store', () => {
  it('loads the head revision as normalised entries, clean', async () => {
    const store = useStudyStore()
    await store.load(7)
    expect(store.entries.spec.vrefV).toBe('2.5 V')
    expect(store.entries.process.matchingPctUm).toBe('0.8 %·µm')
    expect(store.baseVersion).toBe(2)
    expect(store.dirty).toBe(false)
    expect(store.errorCount).toBe(0)
  })

  it('keeps a wrong unit as an error in place and refuses to save it', async () => {
    const store = useStudyStore()
    await store.load(7)
    store.setEntry('spec', 'vrefV', '2 kohm')
    expect(store.errors.spec.vrefV).toContain('must be a voltage')
    expect(await store.save()).toBeNull()
    expect(server.posted).toHaveLength(0)
  })

  it('saves the next revision on its base version, keeping fields outside the catalogue', async () => {
    const store = useStudyStore()
    await store.load(7)
    store.setEntry('spec', 'vrefV', '3300 mV')
    expect(store.dirty).toBe(true)
    const saved = await store.save('raise the reference')
    expect(saved?.number).toBe(3)
    expect(server.posted[0]).toMatchObject({ baseVersion: 2, note: 'raise the reference', spec: { vrefV: 3.3, temperatureK: 300 }, process: { twoRConstruction: 'two-units' } })
    expect(store.baseVersion).toBe(3)
    expect(store.dirty).toBe(false)
  })

  it('on a 409 keeps the edits, then reloads the latest and re-applies them on top', async () => {
    const store = useStudyStore()
    await store.load(7)
    store.setEntry('spec', 'dnlTargetLsb', '0.25 LSB')
    server.refuseWith = 3
    // Meanwhile someone else saved revision 3 with another INL target.
    server.version = 3
    server.spec = { ...SPEC, inlTargetLsb: 1 }
    expect(await store.save()).toBeNull()
    expect(store.conflictVersion).toBe(3)
    expect(store.entries.spec.dnlTargetLsb).toBe('0.25 LSB')
    await store.reloadKeepingEdits()
    expect(store.baseVersion).toBe(3)
    expect(store.conflictVersion).toBeNull()
    expect(store.entries.spec.inlTargetLsb).toBe('1 LSB')
    expect(store.entries.spec.dnlTargetLsb).toBe('0.25 LSB')
    expect(store.dirty).toBe(true)
  })

  it('loads the open revision\'s ranking weights, marks the study unsaved when they change, and saves them with the next revision', async () => {
    const mine = { area: 5, yieldMargin: 1, glitch: 0, referenceLoad: 2, settlingMargin: 1, power: 0, complexity: 3 }
    server.weights = mine
    const store = useStudyStore()
    await store.load(7)
    expect(store.weights).toEqual(mine)
    expect(store.dirty).toBe(false)
    store.setWeights({ ...mine, glitch: 4 })
    expect(store.dirty).toBe(true)
    await store.save('weights changed')
    expect(server.posted.at(-1)!.weights).toEqual({ ...mine, glitch: 4 })
    expect(store.dirty).toBe(false)
    expect(store.savedWeights.glitch).toBe(4)
    store.setWeights({ ...mine, glitch: 1 })
    store.discard()
    expect(store.weights.glitch).toBe(4)
  })

  it('starts from the default weights for a revision saved before weights were kept', async () => {
    server.weights = null
    const store = useStudyStore()
    await store.load(7)
    // the defaults of shared/findings/weights.ts (area 3, yield margin 2, the rest 1)
    expect(store.weights).toEqual({ area: 3, yieldMargin: 2, glitch: 1, referenceLoad: 1, settlingMargin: 1, power: 1, complexity: 1 })
    expect(store.dirty).toBe(false)
  })
})
