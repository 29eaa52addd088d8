/**
 * Which decimal separator the data rows of a file actually use, for `spherecov inspect`: the
 * dialect sniffer only says whether decimal commas are accepted (with ';' or tab delimiters);
 * this reads the numbers of the first 64 KiB after the header and reports what it found.
 */
import { closeSync, openSync, readSync } from 'node:fs';

export type DecimalSeparatorSeen = 'point' | 'comma' | 'both' | 'none';

const HEAD = 64 * 1024;

/**
 * Classify the number cells of `text` (data rows only, split at `delimiter`): a cell like
 * `12,5` is a decimal comma (only possible when the delimiter is not ','), a cell like `12.5`
 * or `.5` a decimal point; whole numbers say nothing. 'none' when no cell has a fraction.
 * @example separatorInText('1;12,5\n2;13,0', ';') === 'comma'
 */
export function separatorInText(text: string, delimiter: string): DecimalSeparatorSeen {
  let point = false;
  let comma = false;
  for (const line of text.split(/\r?\n/)) {
    if (line.startsWith('#')) continue;
    for (const cell of line.split(delimiter)) {
      const c = cell.trim().replace(/^"(.*)"$/, '$1');
      if (delimiter !== ',' && /^[+-]?\d+,\d+([eE][+-]?\d+)?$/.test(c)) comma = true;
      else if (/^[+-]?\d*\.\d+([eE][+-]?\d+)?$/.test(c)) point = true;
    }
    if (point && comma) break;
  }
  return point && comma ? 'both' : comma ? 'comma' : point ? 'point' : 'none';
}

/** The separator seen in the data rows of a file after its 1-based header line (first 64 KiB). */
export function decimalSeparatorSeen(file: string, delimiter: string, headerLine: number): DecimalSeparatorSeen {
  let fd = -1;
  try {
    fd = openSync(file, 'r');
    const buf = Buffer.alloc(HEAD);
    const n = readSync(fd, buf, 0, HEAD, 0);
    let text = buf.subarray(0, n).toString('utf8').replace(/^\uFEFF/, '');
    if (n === HEAD) text = text.slice(0, Math.max(0, text.lastIndexOf('\n')));
    return separatorInText(text.split(/\n/).slice(headerLine).join('\n'), delimiter);
  } catch {
    return 'none';
  } finally {
    if (fd >= 0) closeSync(fd);
  }
}
