import { KEY, NUM, type FieldPlan } from './fieldPlan.js';
import { clipText, ErrorList, inputError } from './inputError.js';
import type { KeyTable } from './keyTable.js';
import { expectedNumber, parseNumberText } from './numberText.js';
import type { RowLocator, RowSink } from './rowSink.js';

/** What a tokenizer needs to turn fields into a sink row. */
export interface TokenContext {
  file: string;
  fields: FieldPlan;
  delimiter: string;
  decimalComma: boolean;
  errors: ErrorList;
  keys: KeyTable;
  sink: RowSink;
  nums: Float64Array;
  keyIds: Int32Array;
  /** Dropout tokens (trimmed, lower case) read as missing samples in value fields; null = strict. */
  dropoutTokens: ReadonlySet<string> | null;
  /** Set `now` (from the sink) to stop the fast path after the current row. */
  halt?: { now: boolean };
}

/**
 * The reference reading of one row from its text fields, shared by both parser paths (the
 * fast path hands every row it does not fully understand to this function, so both paths give
 * the same numbers and the same errors). Blank rows are skipped; a row with too few fields, a
 * non-empty extra field or a bad number gives one error and is dropped.
 */
export function processTextRow(fields: string[], line: number, loc: RowLocator, t: TokenContext): void {
  if (fields.length === 1 && fields[0].trim() === '') return;
  const n = t.fields.kinds.length;
  const names = t.fields.names;
  if (fields.length < n) {
    const found = `'${clipText(loc.rowText())}' (${fields.length} field${fields.length === 1 ? '' : 's'})`;
    t.errors.add(inputError(t.file, line, loc.end(), names[fields.length], found, `${n} fields (${names.join(t.delimiter === '\t' ? ' ' : t.delimiter)})`, true));
    return;
  }
  for (let f = n; f < fields.length; f++) {
    if (fields[f].trim() !== '') {
      t.errors.add(inputError(t.file, line, loc.col(f), 'row', fields[f].trim(), `${n} fields (nothing after '${names[n - 1]}')`));
      return;
    }
  }
  for (let f = 0; f < n; f++) {
    const kind = t.fields.kinds[f];
    if (kind === NUM) {
      const v = parseNumberText(fields[f], t.decimalComma);
      if (typeof v !== 'number' && t.dropoutTokens !== null && t.fields.values[f] === 1 && t.dropoutTokens.has(fields[f].trim().toLowerCase())) {
        t.nums[t.fields.slots[f]] = NaN; // a missing sample: the sink records and skips it
        continue;
      }
      if (typeof v !== 'number') {
        t.errors.add(inputError(t.file, line, loc.col(f), names[f], fields[f].trim(), expectedNumber(v)));
        return;
      }
      t.nums[t.fields.slots[f]] = v;
    } else if (kind === KEY) {
      const text = fields[f].trim();
      if (text === '') {
        t.errors.add(inputError(t.file, line, loc.col(f), names[f], '', 'a name or number'));
        return;
      }
      t.keyIds[t.fields.slots[f]] = t.keys.intern(t.fields.slots[f], text);
    }
  }
  t.sink.row(line, t.nums, t.keyIds, loc);
}
