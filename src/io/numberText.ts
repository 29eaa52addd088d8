/** Result of reading one numeric cell from text: a finite number or the kind of problem. */
export type NumberCell = number | 'empty' | 'non-finite' | 'not-a-number';

const NUMBER_RE = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;
const NON_FINITE_RE = /^[+-]?(nan|inf|infinity|1\.#inf|1\.#ind|1\.#qnan)$/i;

/**
 * Read a numeric cell the way both parser paths must: surrounding spaces ignored; plain
 * decimal or exponent notation; with `decimalComma` a ',' is the decimal separator (a '.' is
 * still accepted, but not both). The value is `Number(text)`, the correctly rounded double.
 * Cost O(length).
 * @example parseNumberText(' 12,5 ', true) // 12.5
 */
export function parseNumberText(raw: string, decimalComma: boolean): NumberCell {
  let text = raw.trim();
  if (text === '') return 'empty';
  if (decimalComma && text.includes(',')) {
    if (text.includes('.')) return 'not-a-number';
    text = text.replace(',', '.');
  }
  if (NUMBER_RE.test(text)) {
    const value = Number(text);
    return Number.isFinite(value) ? value : 'non-finite';
  }
  if (NON_FINITE_RE.test(text)) return 'non-finite';
  return 'not-a-number';
}

/** "expected …" text for a failed numeric cell. */
export function expectedNumber(kind: Exclude<NumberCell, number>): string {
  if (kind === 'non-finite') return 'a finite number';
  return 'a number';
}
