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

/**
 * Text a spreadsheet would change on import by reading it as a number, date, time, percentage or
 * truth value (`0012` → 12, `1e5` → 100000, `12.50` → 12.5, `3/4`, `12:30`, `45 %`, `TRUE`):
 * serial numbers must stay as written. A plain number that reads back unchanged (`5`, `-3.25`)
 * is left alone: the spreadsheet shows exactly that text.
 */
export function looksLikeSpreadsheetValue(text: string): boolean {
  const t = text.trim();
  if (/^[+-]?(\d[\d,]*)?(\.\d*)?(e[+-]?\d+)?\s*%?$/i.test(t) && /\d/.test(t)) return String(Number(text)) !== text;
  return /^\d{1,4}[-/.]\d{1,2}([-/.]\d{1,4})?$/.test(t)
    || /^\d{1,2}:\d{2}(:\d{2})?$/.test(t)
    || /^(true|false)$/i.test(t);
}

/**
 * One CSV cell: numbers via shortest round-trip form, null/undefined/NaN empty, text neutralized.
 * Text that a spreadsheet would read as a value is written as the constant formula `="0012"`,
 * which LibreOffice Calc and Excel show as the text 0012 (checked by converting with LibreOffice
 * in test/batch/spreadsheet.test.ts); results.json keeps the name verbatim.
 */
export function csvCell(value: CsvCell): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  if (looksLikeSpreadsheetValue(value)) return quote(`="${value}"`);
  return quote(neutralizeCell(value));
}

/** The UTF-8 byte order mark: lets a spreadsheet program recognise UTF-8 (non-ASCII unit names). */
export const UTF8_BOM = '\uFEFF';

/** Rows to CSV text with a UTF-8 BOM, CRLF line ends (RFC 4180) and a final line break. */
export function toCsv(header: string[], rows: CsvCell[][]): string {
  const lines = [header.map((h) => quote(neutralizeCell(h))).join(',')];
  for (const row of rows) lines.push(row.map(csvCell).join(','));
  return UTF8_BOM + lines.join('\r\n') + '\r\n';
}
