import type { Severity } from '#shared/findings/schema'

/** Shape, word and colour tokens of each finding severity (DESIGN.md: never colour alone). */
export const SEVERITY_LOOK: Record<Severity, { shape: string, word: string, text: string, border: string }> = {
  fail: { shape: '✕', word: 'Fails spec', text: 'text-fail', border: 'border-l-fail' },
  warn: { shape: '▲', word: 'Risk', text: 'text-risk-ink', border: 'border-l-risk' },
  advice: { shape: '◆', word: 'Suggestion', text: 'text-copper-ink', border: 'border-l-copper' },
  note: { shape: '•', word: 'Note', text: 'text-slate', border: 'border-l-slate' }
}

export const SEVERITY_SEQUENCE: readonly Severity[] = ['fail', 'warn', 'advice', 'note']
