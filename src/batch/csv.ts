/**
 * CSV writing for summary.csv and build-stats.csv: what a cell says is decided here (numbers,
 * formula neutralization, text a spreadsheet would change); RFC 4180 quoting and the joining of
 * cells and lines are papaparse's `unparse` (the library the readers already use).
 */
import type { UnparseConfig } from 'papaparse';
import { papa } from '../io/papa.js';

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

/**
 * papaparse's unparse with RFC 4180 (§2) quoting only: a cell is quoted when it holds a comma, a
 * double quote, a line break or a byte order mark, or begins or ends with a space (which a
 * spreadsheet could trim), and a quote inside is doubled. Formula escaping is ours (csvText),
 * not papaparse's `escapeFormulae`, which would also quote every neutralized cell.
 */
const UNPARSE: UnparseConfig = { delimiter: ',', newline: '\r\n', quotes: false, quoteChar: '"', escapeChar: '"', escapeFormulae: false, header: false };

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
 * What one cell says, before quoting: numbers via shortest round-trip form, null/undefined/NaN
 * empty, text neutralized. Text that a spreadsheet would read as a value is written as the
 * constant formula `="0012"`, which LibreOffice Calc and Excel show as the text 0012 (checked by
 * converting with LibreOffice in test/batch/spreadsheet.test.ts); results.json keeps the name verbatim.
 */
function csvText(value: CsvCell): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  if (typeof value === 'boolean') return value ? 'true' : 'false';
  if (looksLikeSpreadsheetValue(value)) return `="${value}"`;
  return neutralizeCell(value);
}

/** One CSV cell as written in a file: csvText, quoted where RFC 4180 needs it. */
export function csvCell(value: CsvCell): string {
  return papa().unparse([[csvText(value)]], UNPARSE);
}

/** The UTF-8 byte order mark: lets a spreadsheet program recognise UTF-8 (non-ASCII unit names). */
export const UTF8_BOM = '\uFEFF';

/** Rows to CSV text with a UTF-8 BOM, CRLF line ends (RFC 4180) and a final line break. */
export function toCsv(header: string[], rows: CsvCell[][]): string {
  const table = [header.map(neutralizeCell), ...rows.map((row) => row.map(csvText))];
  return UTF8_BOM + papa().unparse(table, UNPARSE) + '\r\n';
}
