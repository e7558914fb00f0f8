/**
 * Bench data: a measured transfer as CSV, one line per code (`code,voltage` or `code,current`).
 * Columns are separated by commas, semicolons or tabs, and with a semicolon or tab numbers may use
 * a decimal comma (benchFormat.ts). A first line with words is a header; `#` lines and empty lines
 * are skipped. Every problem is reported with its line number (one message for a problem repeated
 * on many lines); the file is valid only when it has exactly the codes
 * 0 … 2^N − 1 of the study's resolution, each once.
 */
import { readCsvRecords, type CsvRecord } from './csv'
import { benchFormat, codeRanges, foldRepeated, numberText, type BenchFormat } from './benchFormat'
import { dnlAbsLsb, inlAbsLsb, linearityFromLevels, newLinearityResult, type InlDefinition, type LinearityResult } from '../core/stats/linearity'

export interface BenchLineError { line: number | null, message: string }
export type BenchQuantity = 'voltage' | 'current'

export interface BenchParsed {
  quantity: BenchQuantity
  /** measured level of each code, index = code (volts or amperes) */
  levels: number[]
}

/** Most lines listed in an answer; the count of the rest is added. */
export const MAX_LISTED_BENCH_ERRORS = 50
/** Most bytes of a bench file (a 16-bit file with generous formatting). */
export const MAX_BENCH_CHARS = 4 * 2 ** 20

const NUMBER = /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i
const CODE = /^\d+$/

function quantityOf(name: string): BenchQuantity | null {
  const n = name.toLowerCase()
  if (/^(i|iout|current)\b|current|\(a\)|\[a\]|\(ma\)|\(ua\)|\(µa\)/.test(n)) return 'current'
  if (/^(v|vout|voltage|level|output)\b|volt|\(v\)|\[v\]|\(mv\)/.test(n)) return 'voltage'
  return null
}

/** Parses and checks a bench file for a study of `bits` bits. */
export function parseBenchCsv(text: string, bits: number, expected: BenchQuantity = 'voltage'): { ok: true, value: BenchParsed } | { ok: false, errors: BenchLineError[], total: number } {
  const errors: BenchLineError[] = []
  const fail = () => {
    const folded = foldRepeated(errors)
    return { ok: false as const, errors: folded.slice(0, MAX_LISTED_BENCH_ERRORS), total: folded.length }
  }
  if (text.length > MAX_BENCH_CHARS) {
    errors.push({ line: null, message: `the file has ${text.length} characters; at most ${MAX_BENCH_CHARS} are read` })
    return fail()
  }
  const found = benchFormat(text)
  if (!found.ok) {
    errors.push({ line: null, message: found.message })
    return fail()
  }
  const format: BenchFormat = found.value
  let records: CsvRecord[]
  try {
    records = readCsvRecords(text, format.delimiter)
  } catch (e) {
    errors.push({ line: null, message: `is not readable CSV: ${(e as Error).message}` })
    return fail()
  }
  const quantity: BenchQuantity = expected
  const first = records[0]
  if (first && first.record.some(c => c !== '' && !NUMBER.test(numberText(c, format)))) {
    records = records.slice(1)
    const named = quantityOf(first.record[1] ?? '')
    if (!/code/i.test(first.record[0] ?? '') || named === null) {
      errors.push({ line: first.info.lines, message: `the header must name a code column and a voltage or current column, e.g. "code,voltage" (got "${first.record.join(',')}")` })
      return fail()
    }
    if (named !== expected) {
      errors.push({ line: first.info.lines, message: `the header names a ${named}, but this candidate's output is a ${expected}` })
      return fail()
    }
  }
  const n = 2 ** bits
  const levels = new Array<number>(n).fill(Number.NaN)
  const seenOn = new Map<number, number>()
  for (const { record, info } of records) {
    const line = info.lines
    const [codeText = '', valueText = ''] = record
    if (record.length > 2 && record.slice(2).some(c => c !== '')) {
      errors.push({ line, message: `has ${record.length} columns; a line is a code and one ${quantity}` })
      continue
    }
    if (codeText === '') {
      errors.push({ line, message: 'the code is missing' })
      continue
    }
    if (!CODE.test(codeText)) {
      errors.push({ line, message: `the code must be a whole number from 0 to ${n - 1} (got "${codeText}")` })
      continue
    }
    const code = Number(codeText)
    if (code >= n) {
      errors.push({ line, message: `code ${code} is outside 0 to ${n - 1} of a ${bits}-bit study` })
      continue
    }
    if (valueText === '') {
      errors.push({ line, message: `the ${quantity} of code ${code} is missing` })
      continue
    }
    const value = numberText(valueText, format)
    if (!NUMBER.test(value)) {
      errors.push({ line, message: `the ${quantity} of code ${code} must be a number (got "${valueText}")` })
      continue
    }
    const earlier = seenOn.get(code)
    if (earlier !== undefined) {
      errors.push({ line, message: `code ${code} appears again (first on line ${earlier})` })
      continue
    }
    seenOn.set(code, line)
    levels[code] = Number(value)
  }
  if (errors.length === 0 && seenOn.size !== n) {
    const missing = levels.flatMap((v, k) => (Number.isNaN(v) ? [k] : []))
    errors.push({ line: null, message: `the file has ${seenOn.size} codes; a ${bits}-bit study needs all ${n} codes 0 to ${n - 1}: ${missing.length === 1 ? 'code' : 'codes'} ${codeRanges(missing)} missing` })
  }
  if (errors.length === 0 && levels[n - 1] === levels[0]) {
    errors.push({ line: seenOn.get(n - 1) ?? null, message: `the ${quantity} of the last code equals that of code 0; there is no transfer to measure` })
  }
  return errors.length ? fail() : { ok: true, value: { quantity, levels } }
}

export interface LinearitySummary {
  inlMaxLsb: number
  inlMinLsb: number
  inlMaxCode: number
  inlMinCode: number
  dnlMaxLsb: number
  dnlMinLsb: number
  dnlMaxCode: number
  dnlMinCode: number
  inlAbsLsb: number
  dnlAbsLsb: number
}

export interface BenchSummary {
  endpoint: LinearitySummary
  bestFit: LinearitySummary
  /** every step goes the way of the whole transfer */
  monotonic: boolean
}

function summary(levels: number[], def: InlDefinition): LinearitySummary {
  const r: LinearityResult = linearityFromLevels(levels, def, newLinearityResult())
  return { ...r, inlAbsLsb: inlAbsLsb(r), dnlAbsLsb: dnlAbsLsb(r) }
}

/** Measured INL and DNL (LSB) by the engine's own extraction, end-point and best-fit. */
export function benchSummary(levels: number[]): BenchSummary {
  const endpoint = summary(levels, 'endpoint')
  return { endpoint, bestFit: summary(levels, 'best-fit'), monotonic: endpoint.dnlMinLsb > -1 }
}
