
/** Fixed decimals, '—' for null/non-finite; '-0.00' printed as '0.00'. */
export function fmt(v: number | null | undefined, digits = 2): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  const s = v.toFixed(digits);
  return /^-0\.?0*$/.test(s) ? s.slice(1) : s;
}

/** A fraction of 4π as percent. */
export function pct(f: number | null | undefined, digits = 1): string {
  return f === null || f === undefined || !Number.isFinite(f) ? '—' : `${fmt(100 * f, digits)} %`;
}

export function fmtFrequency(hz: number | null): string {
  if (hz === null) return 'not given';
  if (hz >= 1e9) return `${fmt(hz / 1e9, 3)} GHz`;
  if (hz >= 1e6) return `${fmt(hz / 1e6, 3)} MHz`;
  return `${fmt(hz, 0)} Hz`;
}

/** A frequency in as few characters as it needs, for keys and titles: `28 GHz`, `26.5 GHz`, `—` when not given. */
export function fmtFrequencyShort(hz: number | null): string {
  if (hz === null) return '—';
  if (hz >= 1e9) return `${Number((hz / 1e9).toFixed(3))} GHz`;
  if (hz >= 1e6) return `${Number((hz / 1e6).toFixed(3))} MHz`;
  return `${fmt(hz, 0)} Hz`;
}

/** Owned by src/quantity.ts; re-exported for the report's imports. */
export { quantityLabel } from '../quantity.js';

export const verdictText = (v: 'pass' | 'fail' | 'none'): string => (v === 'pass' ? 'PASS' : v === 'fail' ? 'FAIL' : 'NOT JUDGED');

/** Step of about `count` intervals over [lo, hi] from 1, 2, 2.5, 5 × 10^k. */
export function niceStep(lo: number, hi: number, count: number): number {
  const raw = Math.max(hi - lo, 1e-9) / Math.max(1, count);
  const mag = Math.pow(10, Math.floor(Math.log10(raw)));
  for (const m of [1, 2, 2.5, 5, 10]) if (m * mag >= raw) return m * mag;
  return 10 * mag;
}

/** [lo, hi] widened to multiples of a nice step, and the ticks. */
export function niceRange(lo: number, hi: number, count = 6): { lo: number; hi: number; step: number; ticks: number[] } {
  if (!(hi > lo)) {
    lo -= 1;
    hi += 1;
  }
  const step = niceStep(lo, hi, count);
  const a = Math.floor(lo / step + 1e-9) * step;
  const b = Math.ceil(hi / step - 1e-9) * step;
  const ticks: number[] = [];
  for (let t = a; t <= b + step * 1e-6; t += step) ticks.push(Math.abs(t) < step * 1e-9 ? 0 : t);
  return { lo: a, hi: b, step, ticks };
}

/** Decimals needed to print ticks of this step. */
export function stepDigits(step: number): number {
  for (let d = 0; d < 3; d++) if (Math.abs(step * 10 ** d - Math.round(step * 10 ** d)) < 1e-6) return d;
  return 3;
}
