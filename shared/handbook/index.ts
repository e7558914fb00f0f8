/**
 * The in-app handbook (pages/handbook.vue): numbered sections, written for Rungwise from its
 * engineering models, that findings and explanations cite as "§n". Every cited section must exist
 * here (tests/unit/shared/handbook.spec.ts).
 */
import { BASICS } from './basics'
import { SAMPLED_SIZING, SWITCH_DESIGN } from './design'
import { DYNAMICS } from './dynamics'
import { MATCHING } from './matching'
import type { HandbookSection } from './types'

export type { HandbookLabel, HandbookSection } from './types'

/** Every section in reading order. */
export const HANDBOOK: readonly HandbookSection[] = [...BASICS, ...MATCHING, ...SAMPLED_SIZING, ...DYNAMICS, ...SWITCH_DESIGN]

/** The page's anchor of a section number ("4.3" → "section-4-3"). */
export function handbookAnchor(id: string): string {
  return `section-${id.replace(/\./g, '-')}`
}

/** The section numbers a citation names: "§4.3 item 1" → ["4.3"], "§4.6, §6" → ["4.6", "6"]. */
export function citedSections(citation: string): string[] {
  return [...citation.matchAll(/§\s?(\d+(?:\.\d+)*)/g)].map(m => m[1]!)
}

/** The section of a number, or undefined. */
export function handbookSection(id: string): HandbookSection | undefined {
  return HANDBOOK.find(s => s.id === id)
}

/** Link target of a section on the handbook page. */
export function handbookHref(id: string): string {
  return `/handbook#${handbookAnchor(id)}`
}
