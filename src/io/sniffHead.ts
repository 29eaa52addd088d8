import { papa } from './papa.js';
import type { InputError } from '../types.js';
import { inputError } from './inputError.js';

export const HEAD_BYTES = 64 * 1024;

/** What the first kilobytes of a file say about it. */
export interface HeadInfo {
  bom: boolean;
  delimiter: ',' | ';' | '\t';
  decimalComma: boolean;
  lineEnding: 'LF' | 'CRLF';
  metadata: Record<string, string>;
  metadataLines: Record<string, number>;
  headerLine: number;
  headerText: string;
  headerCells: string[];
  headerCellCols: number[];
  /** Offsets just after the header line's newline: in bytes (file) and in characters (text without BOM). */
  dataByteStart: number;
  dataCharStart: number;
  /** The data part of the head holds a quote character: use the general path. */
  quoted: boolean;
  /** How the header line was chosen: the first row, detected below a free-text preamble, or the job file's header_line. */
  headerChoice: 'first-row' | 'detected' | 'job';
  /** Non-comment lines before the header that were skipped as a preamble. */
  preambleLines: number;
}

/** How to find the header: the job file's line, and a test that a row names a layout's header. */
export interface HeaderRule {
  /** 1-based physical line of the header (job file `header_line`). */
  line?: number;
  /** Does this row (split at the given delimiter) look like a header? */
  isHeader?: (cells: string[]) => boolean;
}

const PREAMBLE_META_RE = /^\s*([A-Za-z][\w .-]*?)\s*[:=]\s*(.*?)\s*$/;
const DELIMITERS = [',', ';', '\t'];

const META_RE = /^#\s*([A-Za-z][\w .-]*?)\s*[:=]\s*(.*?)\s*$/;

/** Binary data: a NUL byte, or many control bytes, in the head. */
function binaryAt(head: Buffer): number {
  const nul = head.indexOf(0);
  if (nul >= 0) return nul;
  let ctrl = 0;
  for (let i = 0; i < head.length; i++) {
    const c = head[i];
    if (c < 9 || (c > 13 && c < 32)) {
      if (++ctrl > 8 && ctrl * 20 > Math.min(head.length, 4096)) return i;
    }
  }
  return -1;
}

function lineColOf(head: Buffer, offset: number): [number, number] {
  let line = 1;
  let lastNl = -1;
  for (let i = 0; i < offset; i++) if (head[i] === 10) [line, lastNl] = [line + 1, i];
  return [line, offset - lastNl];
}

/**
 * Read the preamble (comments, `# key: value` metadata), the header line and the dialect
 * (delimiter by papaparse's guesser over the header and the first rows; decimal commas accepted
 * when the delimiter is ';' or tab; BOM; line ending) from the head bytes.
 */
export function sniffHead(file: string, head: Buffer, wholeFile: boolean, rule: HeaderRule = {}): HeadInfo | InputError {
  if (head.length === 0) return inputError(file, 1, 1, 'file', 'an empty file', 'a header row and data rows', true);
  const bin = binaryAt(head);
  if (bin >= 0) {
    const [line, col] = lineColOf(head, bin);
    const byte = head[bin].toString(16).padStart(2, '0');
    return inputError(file, line, col, 'file', `binary data (byte 0x${byte} at offset ${bin})`, 'a text export (CSV, TSV or TXT)', true);
  }
  const bom = head[0] === 0xef && head[1] === 0xbb && head[2] === 0xbf;
  let body = head.subarray(bom ? 3 : 0);
  if (!wholeFile) {
    const lastNl = body.lastIndexOf(10);
    body = body.subarray(0, lastNl + 1);
  }
  const text = body.toString('utf8');
  const metadata: Record<string, string> = {};
  const metadataLines: Record<string, number> = {};
  let pos = 0;
  let line = 1;
  type Line = { text: string; line: number; start: number; next: number };
  let header: Line | null = null;
  /** The first row: the header when no row below it looks like one (or no test is given). */
  let firstRow: Line | null = null;
  /** Non-comment rows before a detected header, with the metadata they would give. */
  const preamble: Line[] = [];
  while (pos < text.length) {
    const nl = text.indexOf('\n', pos);
    const next = nl < 0 ? text.length : nl + 1;
    const raw = text.slice(pos, nl < 0 ? text.length : nl).replace(/\r$/, '');
    const here: Line = { text: raw, line, start: pos, next };
    if (rule.line !== undefined) {
      if (line === rule.line) {
        if (raw.startsWith('#') || raw.trim() === '') {
          return inputError(file, line, 1, 'header', raw.trim() === '' ? 'a blank line' : raw, 'the header row at this line (header_line in the job file)', raw.trim() === '');
        }
        header = here;
        break;
      }
      if (raw.startsWith('#')) readMeta(META_RE, raw, line, metadata, metadataLines);
      else if (raw.trim() !== '') preamble.push(here);
    } else if (raw.startsWith('#')) {
      if (firstRow === null) readMeta(META_RE, raw, line, metadata, metadataLines);
    } else if (raw.trim() !== '') {
      if (rule.isHeader === undefined) {
        header = here;
        break;
      }
      if (DELIMITERS.some((d) => rule.isHeader!(raw.split(d).map(unquote)))) {
        header = here;
        break;
      }
      firstRow ??= here;
      preamble.push(here);
    }
    pos = next;
    line++;
  }
  let headerChoice: HeadInfo['headerChoice'] = rule.line !== undefined ? 'job' : 'first-row';
  if (header && preamble.length > 0 && rule.line === undefined) headerChoice = 'detected';
  if (!header && firstRow) {
    // No row looks like a header: the first row is the header (its problems are reported there).
    header = firstRow;
    preamble.length = 0;
  }
  if (header && rule.line === undefined && headerChoice === 'detected') {
    // '#' lines below the first row were not read above; a detected header keeps them all.
    scanComments(text, firstRow!.start, header.start, firstRow!.line, metadata, metadataLines);
  }
  for (const p of preamble) readMeta(PREAMBLE_META_RE, p.text, p.line, metadata, metadataLines);
  if (!header && rule.line !== undefined) {
    return inputError(file, rule.line, 1, 'header', `no line ${rule.line} in the first 64 KiB`, 'the header row at this line (header_line in the job file)', true);
  }
  if (!header) {
    if (!wholeFile) return inputError(file, line, 1, 'header', 'no header row in the first 64 KiB', 'a header row naming the columns', true);
    const what = Object.keys(metadata).length || text.trim() ? 'only comment lines' : 'an empty file';
    return inputError(file, 1, 1, 'file', what, 'a header row and data rows', true);
  }
  const lineEnding = text[header.next - 2] === '\r' && text[header.next - 1] === '\n' ? 'CRLF' : 'LF';
  const sampleEnd = nthLineEnd(text, header.start, 21);
  const sample = text.slice(header.start, sampleEnd);
  const guess = papa().parse<string[]>(sample, { delimitersToGuess: [',', ';', '\t'], comments: '#', skipEmptyLines: true, preview: 21 });
  const delimiter = (guess.meta.delimiter === ';' || guess.meta.delimiter === '\t' ? guess.meta.delimiter : ',') as HeadInfo['delimiter'];
  // With ';' or tab a decimal comma is accepted everywhere ('.' still reads as a decimal point,
  // never both in one number), so a file whose first rows happen to be integers is read alike.
  const decimalComma = delimiter !== ',';
  const headerCells = header.text.includes('"') ? papa().parse<string[]>(header.text, { delimiter }).data[0] ?? [''] : header.text.split(delimiter);
  const headerCellCols = cellCols(header.text, delimiter);
  const dataPart = text.slice(header.next);
  return {
    bom,
    delimiter,
    decimalComma,
    lineEnding,
    metadata,
    metadataLines,
    headerLine: header.line,
    headerText: header.text,
    headerCells,
    headerCellCols,
    dataByteStart: (bom ? 3 : 0) + byteOffsetOfLine(body, text, header.next),
    dataCharStart: header.next,
    quoted: dataPart.includes('"'),
    headerChoice,
    preambleLines: preamble.length,
  };
}

/** A header cell without surrounding quotes (detection only; the header itself is split by papaparse). */
function unquote(cell: string): string {
  const t = cell.trim();
  return t.length >= 2 && t.startsWith('"') && t.endsWith('"') ? t.slice(1, -1) : t;
}

function readMeta(re: RegExp, raw: string, line: number, metadata: Record<string, string>, lines: Record<string, number>): void {
  const m = re.exec(raw);
  if (!m) return;
  const key = m[1].trim().toLowerCase();
  metadata[key] = m[2];
  lines[key] = line;
}

/** Read the '#' metadata lines of text[from, to) (line numbers from `line`). */
function scanComments(text: string, from: number, to: number, line: number, metadata: Record<string, string>, lines: Record<string, number>): void {
  let pos = from;
  let n = line;
  while (pos < to) {
    const nl = text.indexOf('\n', pos);
    const next = nl < 0 ? text.length : nl + 1;
    const raw = text.slice(pos, nl < 0 ? text.length : nl).replace(/\r$/, '');
    if (raw.startsWith('#')) readMeta(META_RE, raw, n, metadata, lines);
    pos = next;
    n++;
  }
}

/**
 * Byte offset in `body` of the text offset `charPos`, which is 0 or just after a '\n'. Counted by
 * newline bytes, because invalid UTF-8 (a Latin-1 'ü') decodes to U+FFFD and re-encoding the
 * text would give a different length; 0x0A is never part of a multi-byte sequence.
 */
function byteOffsetOfLine(body: Buffer, text: string, charPos: number): number {
  if (charPos >= text.length) return body.length;
  let lines = 0;
  for (let i = text.indexOf('\n'); i >= 0 && i < charPos; i = text.indexOf('\n', i + 1)) lines++;
  let b = 0;
  for (let k = 0; k < lines; k++) b = body.indexOf(10, b) + 1;
  return b;
}

function nthLineEnd(text: string, from: number, n: number): number {
  let p = from;
  for (let i = 0; i < n && p < text.length; i++) {
    const nl = text.indexOf('\n', p);
    p = nl < 0 ? text.length : nl + 1;
  }
  return p;
}

function cellCols(raw: string, delimiter: string): number[] {
  const cols = [1];
  let q = false;
  for (let i = 0; i < raw.length; i++) {
    if (raw[i] === '"') q = !q;
    else if (!q && raw[i] === delimiter) cols.push(i + 2);
  }
  return cols;
}
