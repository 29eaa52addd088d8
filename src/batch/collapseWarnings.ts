import type { Warning } from '../types.js';

/** A code seen this often in one unit is reported once, with the count of the others. */
const COLLAPSE_AT = 3;

/**
 * Fold repeated warnings of one code into one: a unit exported as 16 per-beam files would
 * otherwise carry 16 identical "identity taken from the path" lines, and the one warning that
 * matters drowns in them. The first occurrence is kept (with its file) and says how many
 * other files had the same; codes seen fewer than COLLAPSE_AT times are kept as they are.
 * Order: first appearance of each code.
 */
export function collapseWarnings(warnings: Warning[]): Warning[] {
  const byCode = new Map<string, Warning[]>();
  for (const w of warnings) byCode.set(w.code, [...(byCode.get(w.code) ?? []), w]);
  return [...byCode.values()].flatMap((list) => {
    if (list.length < COLLAPSE_AT) return list;
    const others = new Set(list.slice(1).map((w) => w.file ?? '')).size;
    return [{ ...list[0], message: `${list[0].message} (and alike in ${list.length - 1} more place${list.length === 2 ? '' : 's'}, ${others} file${others === 1 ? '' : 's'})` }];
  });
}
