import { parse } from 'csv-parse/sync'

export interface CsvRecord { record: string[], info: { lines: number } }

/**
 * CSV lines with the line each ends on (1-based): comma, semicolon or tab separated, `#` lines
 * and empty lines skipped, cells trimmed, ragged lines kept for the caller to report.
 * @throws csv-parse's error (with its line) for unreadable text such as an unclosed quote
 */
export function readCsvRecords(text: string): CsvRecord[] {
  return parse(text, { comment: '#', skip_empty_lines: true, relax_column_count: true, bom: true, info: true, trim: true, delimiter: [',', ';', '\t'] }) as unknown as CsvRecord[]
}
