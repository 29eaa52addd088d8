/**
 * The words every output uses for a unit's state: the verdict (including "error" for a unit that
 * could not be read or analyzed), the worst check's margin, whether the sphere was complete, and
 * where the first error is. One place, so the console, summary.csv and summary.pdf say the same.
 */
import type { UnitNotAnalyzed, UnitResult, Verdict } from '../types.js';
import { fmt } from './format.js';

export type UnitVerdict = Verdict | 'error';

/** PASS, FAIL, NOT JUDGED, ERROR. */
export function verdictWord(v: UnitVerdict): string {
  return v === 'pass' ? 'PASS' : v === 'fail' ? 'FAIL' : v === 'none' ? 'NOT JUDGED' : 'ERROR';
}

/** A signed number with fixed decimals (`+1.23`, `-0.40`, `0.00`). */
export function signed(v: number, digits = 2): string {
  const s = fmt(v, digits);
  return v > 0 && s !== fmt(0, digits) ? `+${s}` : s;
}

/**
 * The worst check's margin in its own unit: dB, or percentage points of 4π for a coverage check
 * (with its dB equivalent when known). '—' when there is no judged check.
 */
export function worstMarginText(u: UnitResult): string {
  const w = u.worstCheck;
  if (!w) return '—';
  if (w.marginUnit === 'fraction') {
    const db = w.marginDb === null || w.marginDb === undefined ? '' : `, ${signed(w.marginDb)} dB`;
    return `${signed(100 * w.margin, 1)} pt of 4π${db}`;
  }
  return `${signed(w.margin)} dB`;
}

/** True when the unit was judged (or measured) on less than the whole sphere. */
export function isPartialSphere(u: UnitResult): boolean {
  return !u.grid.fullSphere;
}

/** `full sphere` or `partial sphere (87.3 % of 4π measured)`. */
export function sphereText(u: UnitResult): string {
  return u.grid.fullSphere ? 'full sphere' : `partial sphere (${fmt((100 * u.solidAngleSr) / (4 * Math.PI), 1)} % of 4π measured)`;
}

/** `file:line` (or `file:line:col`, or `file`) of a unit's first error. */
export function errorLocation(e: UnitNotAnalyzed['error']): string {
  return [e.file, e.line, e.column].filter((x) => x !== undefined).join(':');
}

/** The error message without a location prefix that repeats errorLocation. */
export function errorMessage(e: UnitNotAnalyzed['error']): string {
  const loc = errorLocation(e);
  let m = e.message;
  for (const p of [`${loc}: `, `${e.file}:${e.line}: `, `${e.file}: `]) if (m.startsWith(p)) m = m.slice(p.length);
  return m;
}
