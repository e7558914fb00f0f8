import { factLabel, metricLabel } from '#shared/findings/labels'

/**
 * Engine text (cautions) names contract fields as written in the API (`process.bufferOffsetSigmaV`,
 * `unitOhm`, `tauS`); on screen each becomes its label. Text without such names is unchanged.
 */
export function withFieldLabels(text: string): string {
  return text.replace(/\b(?:(spec|process|options|metrics|derived)\.)?([a-z]+[A-Z][A-Za-z0-9]*)\b/g, (whole, fact: string | undefined, field: string) => {
    const label = fact ? factLabel(fact === 'options' ? 'spec' : fact, field) : metricLabel(field)
    const known = label !== field ? label : fact === 'options' ? metricLabel(field) : label
    return known === field ? whole : known
  })
}
