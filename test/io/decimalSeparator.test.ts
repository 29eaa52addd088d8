import { describe, expect, it } from 'vitest';
import path from 'node:path';
import { separatorInText } from '../../src/io/decimalSeparator.js';
import { formatInspect, inspectInput } from '../../src/io/inspectInput.js';

describe('inspect reports the decimal separator it found, not the one it would accept', () => {
  it('classifies number cells', () => {
    expect(separatorInText('1;12,5\n2;13,0', ';')).toBe('comma');
    expect(separatorInText('1\t12.5\n2\t13', '\t')).toBe('point');
    expect(separatorInText('1,12\n2,13', ',')).toBe('none');
    expect(separatorInText('1;12,5\n2;13.5', ';')).toBe('both');
    expect(separatorInText('# 1,5 in a comment\n1;2', ';')).toBe('none');
  });

  it('a tab file with decimal points says "decimal point" (it used to say "decimal comma")', async () => {
    const tsv = path.join(__dirname, '..', '..', 'fixtures', 'io', 'long_tab_reordered.tsv');
    const text = formatInspect(await inspectInput(tsv));
    expect(text).toMatch(/delimiter: tab; decimal point;/);
    const semi = path.join(__dirname, '..', '..', 'fixtures', 'io', 'long_semicolon_comma_bom_crlf.csv');
    expect(formatInspect(await inspectInput(semi))).toMatch(/delimiter: semicolon; decimal comma;/);
  });
});
