/**
 * CSV writing for summary.csv and build-stats.csv: RFC 4180 quoting plus formula neutralization.
 */

/**
 * A text cell that begins with `=`, `+`, `-` or `@` (or a tab / carriage return, which some
 * spreadsheets strip before evaluating) is prefixed with a single quote so a spreadsheet shows
 * it as text instead of running it as a formula (common practice, OWASP "CSV injection").
 * Numbers are written as numbers and never prefixed: −3.2 dBm stays a number.
 * @example neutralizeCell('=1+2') === "'=1+2"
 */
export function neutralizeCell(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}

/** Quote a cell when it holds a delimiter, a quote or a line break (RFC 4180 §2). */
function quote(text: string): string {
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

export type CsvCell = string | number | boolean | null | undefined;

/** One CSV cell: numbers via shortest round-trip form, null/undefined/NaN empty, text neutralized. */
export function csvCell(value: CsvCell): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  return quote(neutralizeCell(value));
}

/** Rows to CSV text with CRLF line ends (RFC 4180) and a final line break. */
export function toCsv(header: string[], rows: CsvCell[][]): string {
  const lines = [header.map((h) => csvCell(h)).join(',')];
  for (const row of rows) lines.push(row.map(csvCell).join(','));
  return lines.join('\r\n') + '\r\n';
}
