import { papa } from './papa.js';
import { inputError } from './inputError.js';
import type { RowLocator } from './rowSink.js';
import { processTextRow, type TokenContext } from './textRow.js';

/** Start offsets of the fields of one raw row, honouring quotes. */
function quotedFieldStarts(raw: string, delimiter: string): number[] {
  const starts = [0];
  let inQuotes = false;
  for (let i = 0; i < raw.length; i++) {
    const c = raw[i];
    if (c === '"') inQuotes = !inQuotes;
    else if (!inQuotes && c === delimiter) starts.push(i + 1);
  }
  return starts;
}

/**
 * The general path: papaparse over the text of the data rows (quoted fields, embedded
 * delimiters and newlines), each row then read by the shared text routine. Physical line
 * numbers are recovered from papaparse's cursor, skipping the comment and blank lines it
 * skipped. Holds the text of the file (used for quoted or irregular files, typically small).
 */
export function generalTokenize(text: string, dataStart: number, startLine: number, newline: '\n' | '\r\n', t: TokenContext): void {
  // A CRLF file with bare LF line ends in it (lines pasted from elsewhere): papaparse would join
  // the LF lines into the next CRLF row, so read it as LF throughout, as the fast path does.
  // Removing the \r of each CRLF keeps every '\n', so line numbers are unchanged.
  if (newline === '\r\n' && /(^|[^\r])\n/.test(text.slice(dataStart))) {
    text = text.slice(0, dataStart) + text.slice(dataStart).replace(/\r\n/g, '\n');
    newline = '\n';
  }
  let pos = dataStart;
  let line = startLine;
  const advance = (to: number): void => {
    for (let i = pos; i < to; i++) if (text.charCodeAt(i) === 10) line++;
    pos = to;
  };
  const lineEnd = (from: number): number => {
    const nl = text.indexOf('\n', from);
    return nl < 0 ? text.length : nl + 1;
  };
  papa().parse<string[]>(text.slice(dataStart), {
    delimiter: t.delimiter,
    newline,
    comments: '#',
    skipEmptyLines: true,
    quoteChar: '"',
    step: (result) => {
      const cursor = dataStart + result.meta.cursor;
      // Skip what papaparse skipped: comment lines and empty lines before this row.
      for (;;) {
        const c = text[pos];
        if (c === '#' || c === '\n' || (c === '\r' && text[pos + 1] === '\n')) advance(lineEnd(pos));
        else break;
      }
      const rowStart = pos;
      const rowLine = line;
      let rawEnd = cursor;
      if (text[rawEnd - 1] === '\n') rawEnd--;
      if (text[rawEnd - 1] === '\r') rawEnd--;
      const raw = text.slice(rowStart, Math.max(rowStart, rawEnd));
      advance(Math.max(pos, cursor));
      const fields = result.data;
      let starts: number[] | null = null;
      const loc: RowLocator = {
        text: (f) => fields[f] ?? '',
        col: (f) => {
          starts ??= quotedFieldStarts(raw, t.delimiter);
          return (starts[f] ?? raw.length) + 1;
        },
        end: () => raw.length + 1,
        rowText: () => raw,
      };
      const quoteErr = result.errors.find((e) => e.type === 'Quotes');
      if (quoteErr) {
        const f = Math.max(0, fields.length - 1);
        t.errors.add(inputError(t.file, rowLine, loc.col(f), t.fields.names[f] ?? 'row', raw.slice(loc.col(f) - 1), 'a closing quote (")'));
        return;
      }
      processTextRow(fields, rowLine, loc, t);
    },
  });
}
