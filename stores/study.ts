import { acceptHMRUpdate, defineStore } from 'pinia'
import type { FieldSection } from '#shared/schemas/fields'
import { readSection, writeSection, type FieldEntry, type SectionEntries } from '#shared/schemas/fieldValues'
import { DEFAULT_WEIGHTS, type RankingWeights } from '#shared/findings/weights'
import type { RevisionDto } from '#shared/types/revisions'
import type { StudyDto } from '#shared/types/studies'
import { canonicalJson } from '#shared/utils/revisionDiff'

const SECTIONS: FieldSection[] = ['spec', 'process', 'options']
type Values = Record<FieldSection, Record<string, unknown>>
type Entries = Record<FieldSection, SectionEntries>

const emptyValues = (): Values => ({ spec: {}, process: {}, options: {} })
const entriesFor = (values: Values): Entries => ({ spec: writeSection('spec', values.spec), process: writeSection('process', values.process), options: writeSection('options', values.options) })

/**
 * The open study: its inputs as typed (text with units), the values the engine would take, the
 * head revision's results, the ranking weights (saved with each revision), the base version a
 * save builds on, and whether anything is unsaved.
 */
export const useStudyStore = defineStore('study', () => {
  const study = ref<StudyDto | null>(null)
  const head = ref<RevisionDto | null>(null)
  /** the stored inputs of the head (fields outside the catalogue are kept as they are) */
  const base = ref<Values>(emptyValues())
  const entries = ref<Entries>(entriesFor(emptyValues()))
  const loadedEntries = ref<Entries>(entriesFor(emptyValues()))
  const snapshot = ref('')
  /** the study's version on the server when a save was refused (409), else null */
  const conflictVersion = ref<number | null>(null)
  const saving = ref(false)
  const saveError = ref('')
  /** the ranking weights as set, and as the head revision has them (the defaults before weights were kept) */
  const weights = ref<RankingWeights>({ ...DEFAULT_WEIGHTS })
  const savedWeights = ref<RankingWeights>({ ...DEFAULT_WEIGHTS })

  const read = computed(() => Object.fromEntries(SECTIONS.map(s => [s, readSection(s, entries.value[s])])) as Record<FieldSection, ReturnType<typeof readSection>>)
  const errors = computed(() => Object.fromEntries(SECTIONS.map(s => [s, read.value[s].errors])) as Record<FieldSection, Record<string, string>>)
  const errorCount = computed(() => SECTIONS.reduce((n, s) => n + Object.keys(errors.value[s]).length, 0))
  const inputs = computed<Values>(() => Object.fromEntries(SECTIONS.map(s => [s, { ...base.value[s], ...read.value[s].values }])) as Values)
  const weightsChanged = computed(() => canonicalJson(weights.value) !== canonicalJson(savedWeights.value))
  const dirty = computed(() => study.value !== null && (canonicalJson(inputs.value) !== snapshot.value || weightsChanged.value))
  const baseVersion = computed(() => study.value?.version ?? 0)
  const results = computed(() => head.value?.results ?? null)

  function reset(values: Values, saved: RankingWeights | null = null) {
    savedWeights.value = { ...DEFAULT_WEIGHTS, ...saved }
    weights.value = { ...savedWeights.value }
    base.value = values
    entries.value = entriesFor(values)
    loadedEntries.value = entriesFor(values)
    snapshot.value = canonicalJson(inputs.value)
  }

  /** Loads a study and its head revision (a study without revisions starts from its spec). */
  async function load(id: number, fetcher: (url: string) => Promise<unknown> = $fetch as (url: string) => Promise<unknown>) {
    const s = await fetcher(`/api/studies/${id}`) as StudyDto
    const h = s.version > 0 ? await fetcher(`/api/studies/${id}/revisions/${s.version}`) as RevisionDto : null
    study.value = s
    head.value = h
    conflictVersion.value = null
    saveError.value = ''
    reset(h ? { spec: h.spec, process: h.process, options: h.options } : { ...emptyValues(), spec: s.spec }, h?.weights ?? null)
  }

  function setEntry(section: FieldSection, key: string, value: FieldEntry) {
    entries.value = { ...entries.value, [section]: { ...entries.value[section], [key]: value } }
  }

  /** Sets the ranking weights (saved with the next revision). */
  function setWeights(next: RankingWeights) {
    weights.value = { ...next }
  }

  /** Fills one section from stored values (a preset's process, a template's spec). */
  function applySection(section: FieldSection, values: Record<string, unknown>) {
    entries.value = { ...entries.value, [section]: { ...entries.value[section], ...writeSection(section, values) } }
  }

  /** The entries the user changed since the last load, by section. */
  function edits(): Partial<Record<FieldSection, SectionEntries>> {
    const out: Partial<Record<FieldSection, SectionEntries>> = {}
    for (const s of SECTIONS) {
      const changed = Object.entries(entries.value[s]).filter(([k, v]) => JSON.stringify(v) !== JSON.stringify(loadedEntries.value[s][k]))
      if (changed.length > 0) out[s] = Object.fromEntries(changed)
    }
    return out
  }

  /** Saves the inputs as the next revision; a 409 keeps the edits and records the server's version. */
  async function save(note?: string, evaluationId?: number) {
    if (!study.value || errorCount.value > 0) return null
    saving.value = true
    saveError.value = ''
    try {
      const body = { baseVersion: baseVersion.value, ...inputs.value, weights: weights.value, ...(note ? { note } : {}), ...(evaluationId ? { evaluationId } : {}) }
      const revision = await $fetch<RevisionDto>(`/api/studies/${study.value.id}/revisions`, { method: 'POST', body })
      head.value = revision
      study.value = { ...study.value, version: revision.number, spec: revision.spec }
      reset({ spec: revision.spec, process: revision.process, options: revision.options }, revision.weights)
      return revision
    } catch (e) {
      const status = (e as { statusCode?: number }).statusCode
      if (status === 409) conflictVersion.value = (e as { data?: { data?: { currentVersion?: number } } }).data?.data?.currentVersion ?? null
      saveError.value = apiErrorMessage(e)
      return null
    } finally {
      saving.value = false
    }
  }

  /** After a 409: loads the latest revision, then puts the user's own edits back on top of it. */
  async function reloadKeepingEdits() {
    if (!study.value) return
    const mine = edits()
    const myWeights = weightsChanged.value ? { ...weights.value } : null
    await load(study.value.id)
    for (const s of SECTIONS) entries.value = { ...entries.value, [s]: { ...entries.value[s], ...mine[s] } }
    if (myWeights) weights.value = myWeights
  }

  /** Drops unsaved edits. */
  function discard() {
    entries.value = JSON.parse(JSON.stringify(loadedEntries.value)) as Entries
    weights.value = { ...savedWeights.value }
  }

  return { study, head, base, entries, loadedEntries, snapshot, conflictVersion, saving, saveError, weights, savedWeights, weightsChanged, read, errors, errorCount, inputs, dirty, baseVersion, results, load, setEntry, setWeights, applySection, edits, save, reloadKeepingEdits, discard }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useStudyStore, import.meta.hot))
