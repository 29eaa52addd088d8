/** Field kinds the tokenizers know: skip it, read a number, or intern a text key. */
export const SKIP = 0;
export const NUM = 1;
export const KEY = 2;

/** What both tokenizers need: per field its kind and slot (index into the row's nums/keys). */
export interface FieldPlan {
  kinds: Uint8Array;
  slots: Int32Array;
  names: string[];
  /** 1 where the field holds a value (where a dropout token may stand for a missing sample). */
  values: Uint8Array;
  numCount: number;
  keyCount: number;
}

/** A field plan of `n` fields, all skipped until added. */
export function fieldPlan(n: number, names: string[]): FieldPlan {
  return { kinds: new Uint8Array(n), slots: new Int32Array(n).fill(-1), names, values: new Uint8Array(n), numCount: 0, keyCount: 0 };
}

/** Read field `index` as a number or a key (`value`: a measured value); gives its slot. */
export function addField(fp: FieldPlan, index: number, kind: typeof NUM | typeof KEY, value = false): number {
  fp.kinds[index] = kind;
  if (value) fp.values[index] = 1;
  const slot = kind === NUM ? fp.numCount++ : fp.keyCount++;
  fp.slots[index] = slot;
  return slot;
}
