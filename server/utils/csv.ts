/** A cell that a spreadsheet would run as a formula is written as text (common practice, no source). */
export function csvCell(value: unknown): string {
  const text = value === null || value === undefined ? '' : String(value)
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text
}
