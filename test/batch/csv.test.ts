import Papa from 'papaparse';
import { describe, expect, it } from 'vitest';
import { csvCell, neutralizeCell, toCsv } from '../../src/batch/csv.js';

describe('formula neutralization (OWASP "CSV injection" guidance, common practice)', () => {
  it.each([
    ['=1+2', "'=1+2"],
    ['+SUM(A1)', "'+SUM(A1)"],
    ['-U-05', "'-U-05"],
    ['@cmd', "'@cmd"],
    ['\tx', "'\tx"],
    ['U-01', 'U-01'],
    ['', ''],
  ])('%j → %j', (input, out) => {
    expect(neutralizeCell(input)).toBe(out);
  });

  it('leaves numbers as numbers, negative ones included', () => {
    expect(csvCell(-88.5)).toBe('-88.5');
    expect(csvCell(Number.NaN)).toBe('');
    expect(csvCell(null)).toBe('');
  });

  it('quotes after neutralizing (RFC 4180)', () => {
    expect(csvCell('=HYPERLINK("x","y")')).toBe(`"'=HYPERLINK(""x"",""y"")"`);
    expect(csvCell('a,b')).toBe('"a,b"');
  });

  it('writes CRLF rows with a final line break', () => {
    expect(toCsv(['unit', 'peak'], [['=1', 3]])).toBe("\uFEFFunit,peak\r\n'=1,3\r\n");
  });

  it('quotes a cell that begins or ends with a space or holds a line break (RFC 4180 §2), and reads back cell for cell', () => {
    expect(csvCell(' U-01')).toBe('" U-01"');
    expect(csvCell('U-01 ')).toBe('"U-01 "');
    expect(csvCell('a\r\nb')).toBe('"a\r\nb"');
    // Round trip through an independent reader (papaparse's parser, RFC 4180 mode).
    const cells = ['plain', ' lead', 'a,b', 'say "hi"', 'two\nlines', 'Ünit-Ω', ''];
    const text = toCsv(['c'], cells.map((c) => [c]));
    const back = Papa.parse<string[]>(text.slice(1), { newline: '\r\n' }).data.slice(1, -1).map((r) => r[0]);
    expect(back).toEqual(cells);
  });
});
