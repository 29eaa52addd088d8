import type { GridSummary, Measurement, Warning } from '../types.js';
import { isFullSphere } from '../sphere/isFullSphere.js';

/** Uniform step of ascending values, or null when the steps differ by more than 1e-6°. */
function uniformStep(values: ArrayLike<number>): number | null {
  if (values.length < 2) return null;
  const step = values[1] - values[0];
  for (let i = 2; i < values.length; i++) if (Math.abs(values[i] - values[i - 1] - step) > 1e-6) return null;
  return +step.toFixed(9);
}

function range(values: Float64Array): [number, number] {
  let lo = Infinity, hi = -Infinity;
  for (const v of values) { if (v < lo) lo = v; if (v > hi) hi = v; }
  return values.length ? [lo, hi] : [0, 0];
}

/** Count of merged samples stated in 'duplicate-merged' warnings (the readers put the number first). */
function countFrom(warnings: Warning[], code: Warning['code']): number {
  let n = 0;
  for (const w of warnings) {
    if (w.code !== code) continue;
    const m = /(\d+)/.exec(w.message);
    n += m ? Number(m[1]) : 1;
  }
  return n;
}

/** Grid facts for the data-quality section of results.json and the report. */
export function gridSummary(m: Measurement): GridSummary {
  const g = m.grid;
  const reg = g.regular;
  return {
    kind: g.kind,
    points: g.thetaDeg.length,
    thetaRangeDeg: range(g.thetaDeg),
    phiRangeDeg: range(g.phiDeg),
    thetaStepDeg: reg ? uniformStep(reg.thetaRowsDeg) : null,
    phiStepDeg: reg ? uniformStep(reg.phiColsDeg) : null,
    fullSphere: isFullSphere(g),
    duplicatesMerged: countFrom(m.warnings, 'duplicate-merged'),
    beamsResampled: m.warnings.filter((w) => w.code === 'beam-resampled').length,
  };
}
