/**
 * How a bench file is written, found before its lines are read: the column separator (semicolon or
 * tab before comma, since a file with decimal commas cannot separate columns with commas) and
 * whether numbers use a decimal comma. Also the wording helpers that keep one problem one message:
 * code ranges ("12–40, 77") and the folding of a problem repeated on many lines.
 */
import type { BenchLineError } from './benchCsv'

export interface BenchFormat {
  delimiter: ',' | ';' | '\t'
  /** numbers are written `0,5` (only with a semicolon or tab separator) */
  decimalComma: boolean
}

const DECIMAL_COMMA = /^[-+]?\d*,\d+(e[-+]?\d+)?$/i
const PLAIN = /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i

function dataLines(text: string): string[] {
  return text.split(/\r?\n/).map(l => l.trim()).filter(l => l !== '' && !l.startsWith('#'))
}

/**
 * The separator and decimal mark of a bench file, or one message saying what is expected when a
 * comma file seems to carry decimal commas too (`0,0,5`: three cells where two are meant).
 */
export function benchFormat(text: string): { ok: true, value: BenchFormat } | { ok: false, message: string } {
  const lines = dataLines(text).slice(0, 200)
  const first = lines[0] ?? ''
  const delimiter = first.includes(';') ? ';' : first.includes('\t') ? '\t' : ','
  if (delimiter !== ',') {
    const values = lines.map(l => l.split(delimiter)[1]?.trim() ?? '')
    return { ok: true, value: { delimiter, decimalComma: values.some(v => DECIMAL_COMMA.test(v)) } }
  }
  const numeric = lines.filter(l => /^\d/.test(l))
  const threeCells = numeric.filter((l) => {
    const cells = l.split(',').map(c => c.trim())
    return cells.length === 3 && cells.every(c => PLAIN.test(c)) && /^\d+$/.test(cells[2]!)
  })
  if (numeric.length > 0 && threeCells.length === numeric.length) {
    return { ok: false, message: `the numbers seem to use a decimal comma ("${numeric[0]}") while commas also separate the columns; separate the columns with a semicolon or a tab ("code;voltage", "0;0,5"), or write decimal points ("0,0.5")` }
  }
  return { ok: true, value: { delimiter, decimalComma: false } }
}

/** A number cell in the file's decimal mark, as JavaScript reads it (`0,5` → `0.5`). */
export function numberText(cell: string, format: BenchFormat): string {
  return format.decimalComma && DECIMAL_COMMA.test(cell) ? cell.replace(',', '.') : cell
}

/** Sorted whole numbers as ranges: [12, 13, …, 40, 77] → "12–40, 77" (at most `limit` ranges). */
export function codeRanges(codes: readonly number[], limit = 20): string {
  const ranges: string[] = []
  for (let i = 0; i < codes.length;) {
    let j = i
    while (j + 1 < codes.length && codes[j + 1] === codes[j]! + 1) j++
    ranges.push(j === i ? String(codes[i]) : `${codes[i]}–${codes[j]}`)
    i = j + 1
  }
  const more = ranges.length - limit
  return more > 0 ? `${ranges.slice(0, limit).join(', ')} and ${more} more ranges` : ranges.join(', ')
}

/** Most lines one kind of problem is listed on before it is folded into one message. */
export const MAX_SAME_PROBLEM = 5

/**
 * Folds a problem repeated on many lines into one message: messages of the same kind (the same
 * words once numbers and quoted text are set aside) beyond MAX_SAME_PROBLEM become "… and the same on
 * N more lines (lines 12–40, 77)".
 */
export function foldRepeated(errors: readonly BenchLineError[]): BenchLineError[] {
  const kindOf = (m: string) => m.replace(/"[^"]*"/g, '"…"').replace(/\d+(\.\d+)?/g, '#')
  const byKind = new Map<string, BenchLineError[]>()
  for (const e of errors) byKind.set(kindOf(e.message), [...(byKind.get(kindOf(e.message)) ?? []), e])
  const out: BenchLineError[] = []
  for (const e of errors) {
    const same = byKind.get(kindOf(e.message))!
    if (same.length <= MAX_SAME_PROBLEM) out.push(e)
    else if (same[0] === e) {
      const lines = same.flatMap(x => (x.line === null ? [] : [x.line]))
      out.push({ line: e.line, message: `${e.message}; the same on ${same.length - 1} more lines (lines ${codeRanges(lines.slice(1), 8)})` })
    }
  }
  return out
}
