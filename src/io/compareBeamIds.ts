/**
 * Natural order of beam ids, so that beams 0, 1, 2, …, 10 are listed as engineers number them
 * rather than as file names sort ("0, 1, 10, 11, 2"). Runs of digits compare by value, other
 * text by code point; equal-valued digit runs of different length ("01" vs "1") fall back to
 * code point order, so the order is total and does not depend on the locale.
 * @example ['10', '2', 'b1', '1'].sort(compareBeamIds) // ['1', '2', '10', 'b1']
 */
export function compareBeamIds(a: string, b: string): number {
  const ta = a.match(/\d+|\D+/g) ?? [];
  const tb = b.match(/\d+|\D+/g) ?? [];
  for (let i = 0; i < Math.min(ta.length, tb.length); i++) {
    const x = ta[i];
    const y = tb[i];
    const dx = /^\d/.test(x);
    const dy = /^\d/.test(y);
    if (dx && dy) {
      const d = Number(x) - Number(y);
      if (d !== 0) return d;
    } else if (dx !== dy) {
      return dx ? -1 : 1;
    }
    if (x !== y) return x < y ? -1 : 1;
  }
  return ta.length - tb.length || (a < b ? -1 : a > b ? 1 : 0);
}
