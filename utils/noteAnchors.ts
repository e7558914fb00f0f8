import type { NoteAnchorDto } from '#shared/types/notes'

/** The metrics the comparison shows, in its order, with the words it uses for them. */
export const NOTE_METRIC_WORDS: Record<string, string> = {
  totalAreaMm2: 'Area',
  maxUpdateRateHz: 'Update rate',
  glitchWorstVs: 'Worst glitch',
  refPowerMaxW: 'Reference power',
  inlSigmaLsb: 'INL σ',
  dnlSigmaLsb: 'DNL σ'
}

export type NoteAnchorInput = { type: 'study' } | { type: 'candidate', candidateId: string } | { type: 'metric', candidateId: string, metricKey: string }

/** "the study", "candidate seg-4", "INL σ of seg-4". */
export function noteAnchorLabel(anchor: NoteAnchorDto | NoteAnchorInput): string {
  if (anchor.type === 'study') return 'the study'
  const candidate = 'candidateId' in anchor ? anchor.candidateId : ''
  if (anchor.type === 'candidate') return `candidate ${candidate}`
  const key = (anchor as { metricKey: string }).metricKey
  return `${NOTE_METRIC_WORDS[key] ?? key} of ${candidate}`
}

/** The key the notes store counts markers by. */
export function noteAnchorKey(candidateId: string, metricKey?: string | null): string {
  return metricKey ? `${candidateId}|${metricKey}` : candidateId
}
