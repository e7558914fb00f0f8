import { parse } from 'csv-parse/sync'

export interface CsvRecord { record: string[], info: { lines: number } }

/** The separator of a file: the first of comma, tab and semicolon found on its first data or header line. */
export function csvDelimiter(text: string): string {
  const first = text.split(/\r?\n/).find(l => l.trim() !== '' && !l.trimStart().startsWith('#')) ?? ''
  return [',', '\t', ';'].find(d => first.includes(d)) ?? ','
}

/**
 * CSV lines with the line each ends on (1-based): comma, tab or semicolon separated (one per
 * file; `delimiter` when the caller found it otherwise), `#` lines and empty lines skipped, cells trimmed, ragged lines kept for the caller to report.
 * @throws csv-parse's error (with its line) for unreadable text such as an unclosed quote
 */
export function readCsvRecords(text: string, delimiter = csvDelimiter(text)): CsvRecord[] {
  return parse(text, { comment: '#', skip_empty_lines: true, relax_column_count: true, bom: true, info: true, trim: true, delimiter }) as unknown as CsvRecord[]
}
