/** Where a statement comes from, in the handbook's own labels (as formulas and rules use them). */
export type HandbookLabel = 'published' | 'derived' | 'common-practice' | 'memory'

/** One numbered section of the in-app handbook. */
export interface HandbookSection {
  /** section number without the sign, e.g. "4.3" (cited as "§4.3") */
  id: string
  title: string
  /** plain paragraphs, our own words */
  body: string[]
  /** key relations, written out (Unicode, no markup) */
  formulas?: { text: string, label: HandbookLabel }[]
  /** what the section rests on; sources are named, not quoted */
  sources: string[]
  /** engineering cautions that belong to this section */
  cautions?: string[]
}
