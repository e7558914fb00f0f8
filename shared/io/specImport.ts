/**
 * Import of specs (one row per study) from CSV or JSON: every row is read with the same field
 * catalogue and engine schemas as the study form and the API, so the messages name the field and
 * its allowed range in the units shown. Pure; the server validates again before it writes.
 */
import { readCsvRecords, type CsvRecord } from './csv'
import { IMPORT_COLUMNS, IMPORT_SCHEMAS, type ImportColumn } from './importColumns'
import { z } from 'zod'
import { evaluateInputSchema, type EvaluateInput } from '../core/contract/evaluate'
import { formatIssues, type FormattedIssue } from '../core/contract/errors'
import { ENGINE_VERSION } from '../core/version'
import { readField } from '../schemas/fieldValues'
import { studyCreateSchema } from '../schemas/study'
import { isStudyDocument, readStudyDocument, type StudyDocumentRead } from './studyDocument'

/** Most rows one import takes. */
export const MAX_IMPORT_ROWS = 200

export interface ImportRow {
  /** CSV: the line of the file (1 = header); JSON: the index in the list + 1 */
  line: number
  title: string
  blockName: string | null
  /** the inputs of the first revision, when the row is valid */
  inputs: EvaluateInput | null
  issues: FormattedIssue[]
}

export interface ImportPreview {
  kind: 'rows' | 'document'
  rows: ImportRow[]
  /** problems of the file itself (header, format), not of one row */
  fileIssues: FormattedIssue[]
  /** a study document: its revisions and results (row 1 holds the head inputs) */
  document: StudyDocumentRead | null
}

const SCHEMAS = IMPORT_SCHEMAS

const BY_NAME = new Map(IMPORT_COLUMNS.map(c => [c.name.toLowerCase(), c]))
const TITLE_NAMES = new Set(['title'])
const BLOCK_NAMES = new Set(['blockname', 'block'])

function cellValue(column: ImportColumn, text: string): { ok: true, value: unknown } | { ok: false, message: string } {
  const def = column.def
  if (def?.kind === 'flag') {
    const t = text.toLowerCase()
    if (['yes', 'true', '1'].includes(t)) return { ok: true, value: true }
    if (['no', 'false', '0'].includes(t)) return { ok: true, value: false }
    return { ok: false, message: `must be yes or no (got "${text}")` }
  }
  if (def?.kind === 'multi') return readField(def, text.split(/[;|\s]+/).map(s => s.trim()).filter(Boolean))
  if (def?.kind === 'choice') return readField(def, def.choices.find(c => c.label.toLowerCase() === text.toLowerCase())?.value ?? text)
  if (def) return readField(def, text)
  // a field outside the catalogue: the contract's own number or word
  const value = /^[-+]?(\d+\.?\d*|\.\d+)(e[-+]?\d+)?$/i.test(text) ? Number(text) : text
  const checked = (SCHEMAS[column.section].shape as Record<string, z.ZodType>)[column.key]!.safeParse(value)
  return checked.success ? { ok: true, value: checked.data } : { ok: false, message: checked.error.issues[0]?.message ?? 'is not valid' }
}

/** Validates one row given as contract values (JSON) or as read from cells (CSV). */
export function checkRow(line: number, raw: Record<string, unknown>, issues: FormattedIssue[] = []): ImportRow {
  const head = studyCreateSchema.pick({ title: true, blockName: true }).safeParse({ title: raw.title, blockName: raw.blockName ?? null })
  if (!head.success) issues.push(...formatIssues(head.error).issues)
  const input = evaluateInputSchema.safeParse({ spec: raw.spec ?? {}, process: raw.process ?? {}, options: raw.options ?? {} })
  if (!input.success) {
    const known = new Set(issues.map(i => i.path))
    issues.push(...formatIssues(input.error).issues.filter(i => !known.has(i.path)))
  }
  const title = typeof raw.title === 'string' ? raw.title.trim() : ''
  const blockName = typeof raw.blockName === 'string' && raw.blockName.trim() !== '' ? raw.blockName.trim() : null
  return { line, title, blockName, inputs: issues.length === 0 && input.success ? input.data : null, issues }
}

function csvRow(line: number, columns: (ImportColumn | 'title' | 'blockName' | null)[], cells: string[]): ImportRow {
  const raw: Record<string, unknown> & { spec: Record<string, unknown>, process: Record<string, unknown>, options: Record<string, unknown> } = { spec: {}, process: {}, options: {} }
  const issues: FormattedIssue[] = []
  columns.forEach((column, i) => {
    const text = (cells[i] ?? '').trim()
    if (column === null) return
    if (column === 'title' || column === 'blockName') {
      raw[column] = text
      return
    }
    if (text === '') return // empty: the engine's default, or its "is missing" message
    const read = cellValue(column, text)
    if (read.ok) raw[column.section][column.key] = read.value
    else issues.push({ path: `${column.section}.${column.key}`, message: read.message })
  })
  return checkRow(line, raw, issues)
}

/** Reads a CSV of specs: a header of column names, then one study per line (`#` lines are comments). */
export function readSpecCsv(text: string): ImportPreview {
  const fileIssues: FormattedIssue[] = []
  let records: CsvRecord[]
  try {
    records = readCsvRecords(text)
  } catch (e) {
    return { kind: 'rows', rows: [], fileIssues: [{ path: '(file)', message: `is not readable CSV: ${(e as Error).message}` }], document: null }
  }
  const [header, ...body] = records
  if (!header) return { kind: 'rows', rows: [], fileIssues: [{ path: '(file)', message: 'is empty; it needs a header line and one line per spec' }], document: null }
  const columns = header.record.map((name) => {
    const n = name.trim().toLowerCase()
    if (TITLE_NAMES.has(n)) return 'title' as const
    if (BLOCK_NAMES.has(n)) return 'blockName' as const
    const column = BY_NAME.get(n.replace(/^(spec|process|options)\./, '')) ?? null
    if (!column) fileIssues.push({ path: `line ${header.info.lines}`, message: `column "${name}" is not a field; columns are title, blockName and ${IMPORT_COLUMNS.map(c => c.name).join(', ')}` })
    return column
  })
  if (!columns.includes('title')) fileIssues.push({ path: `line ${header.info.lines}`, message: 'needs a "title" column' })
  if (body.length === 0) fileIssues.push({ path: '(file)', message: 'has a header but no spec lines' })
  if (body.length > MAX_IMPORT_ROWS) fileIssues.push({ path: '(file)', message: `has ${body.length} spec lines; one import takes at most ${MAX_IMPORT_ROWS}` })
  const rows = fileIssues.length ? [] : body.map(r => csvRow(r.info.lines, columns, r.record))
  return { kind: 'rows', rows, fileIssues, document: null }
}

const jsonRowsSchema = z.array(z.record(z.string(), z.unknown()), { error: 'must be a list of specs: [{ "title", "blockName", "spec", "process", "options" }, …]' })

/** Reads JSON: a list of `{ title, blockName, spec, process, options }` (or `{ studies: [...] }`), or a study document. */
export function readSpecJson(text: string): ImportPreview {
  let value: unknown
  try {
    value = JSON.parse(text)
  } catch (e) {
    return { kind: 'rows', rows: [], fileIssues: [{ path: '(file)', message: `is not valid JSON: ${(e as Error).message}` }], document: null }
  }
  if (isStudyDocument(value)) {
    const read = readStudyDocument(value, ENGINE_VERSION)
    if (!read.ok) return { kind: 'document', rows: [], fileIssues: read.issues, document: null }
    const head = read.document.revisions.at(-1)!
    const row = checkRow(1, { title: read.document.title, blockName: read.document.blockName, ...head.inputs })
    return { kind: 'document', rows: [row], fileIssues: [], document: read.document }
  }
  const list = value !== null && typeof value === 'object' && !Array.isArray(value) && 'studies' in value ? (value as { studies: unknown }).studies : value
  const rows = jsonRowsSchema.safeParse(list)
  if (!rows.success) return { kind: 'rows', rows: [], fileIssues: formatIssues(rows.error).issues.map(i => ({ ...i, path: '(file)' })), document: null }
  if (rows.data.length === 0 || rows.data.length > MAX_IMPORT_ROWS) {
    return { kind: 'rows', rows: [], fileIssues: [{ path: '(file)', message: `must list from 1 to ${MAX_IMPORT_ROWS} specs (got ${rows.data.length})` }], document: null }
  }
  return { kind: 'rows', rows: rows.data.map((r, i) => checkRow(i + 1, r)), fileIssues: [], document: null }
}

/** Reads either format; `json` when the text starts with `{` or `[`. */
export function readSpecImport(text: string, format: 'csv' | 'json' | 'auto' = 'auto'): ImportPreview {
  const json = format === 'json' || (format === 'auto' && /^\s*[[{]/.test(text))
  return json ? readSpecJson(text) : readSpecCsv(text)
}

/** True when every row can be created. */
export function importIsValid(p: ImportPreview): boolean {
  return p.fileIssues.length === 0 && p.rows.length > 0 && p.rows.every(r => r.inputs !== null)
}
