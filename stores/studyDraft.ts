import { acceptHMRUpdate, defineStore } from 'pinia'
import { readSection, writeSection, type FieldEntry, type SectionEntries } from '#shared/schemas/fieldValues'

/** Starting entries of a new study's Targets: a common mid-range trim DAC, to be overwritten. */
const START: SectionEntries = {
  ...writeSection('spec', {}),
  bits: '12', vrefV: '2.5 V', updateRateHz: '1 MS/s', loadCapacitanceF: '10 pF', inlTargetLsb: '0.5 LSB', dnlTargetLsb: '0.5 LSB',
  yieldTarget: '99.7 %', areaBudgetMm2: '0.05 mm²', glitchLimitVs: '50 pV·s', powerBudgetW: '1 mW'
}

/** The new-study form's entries (text with units), kept while the user moves between pages until the study is created. */
export const useStudyDraftStore = defineStore('studyDraft', () => {
  const title = ref('')
  const blockName = ref('')
  const spec = ref<SectionEntries>({ ...START })
  const read = computed(() => readSection('spec', spec.value))
  const dirty = computed(() => title.value !== '' || blockName.value !== '' || JSON.stringify(spec.value) !== JSON.stringify(START))

  function setEntry(key: string, value: FieldEntry) {
    spec.value = { ...spec.value, [key]: value }
  }

  /** Fills the Targets from a template's spec (SI values). */
  function applySpec(values: Record<string, unknown>) {
    spec.value = writeSection('spec', values)
  }

  function reset() {
    title.value = ''
    blockName.value = ''
    spec.value = { ...START }
  }

  return { title, blockName, spec, read, dirty, setEntry, applySpec, reset }
})

if (import.meta.hot) import.meta.hot.accept(acceptHMRUpdate(useStudyDraftStore, import.meta.hot))
