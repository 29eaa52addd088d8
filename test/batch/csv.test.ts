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
});
