import { acceptHMRUpdate, defineStore } from 'pinia'
import type { StudySpecDraft } from '#shared/schemas/study'

type SpecEntry = { [K in keyof StudySpecDraft]: number | '' }

const DEFAULT_SPEC: SpecEntry = { bits: 12, vrefV: 2.5, updateRateHz: 1e6, areaBudgetMm2: 0.05, inlTargetLsb: 0.5, dnlTargetLsb: 0.5, yieldTarget: 0.997 }

/** The new-study form's entries, kept while the user moves between pages until the study is created. */
export const useStudyDraftStore = defineStore('studyDraft', () => {
  const title = ref('')
  const blockName = ref('')
  const spec = reactive<SpecEntry>({ ...DEFAULT_SPEC })
  const dirty = computed(() => title.value !== '' || blockName.value !== ''
    || (Object.keys(DEFAULT_SPEC) as (keyof SpecEntry)[]).some(k => spec[k] !== DEFAULT_SPEC[k]))

  function reset() {
    title.value = ''
    blockName.value = ''
    Object.assign(spec, DEFAULT_SPEC)
  }

  return { title, blockName, spec, dirty, reset }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useStudyDraftStore, import.meta.hot))
