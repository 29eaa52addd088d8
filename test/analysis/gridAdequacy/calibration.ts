/**
 * The calibration experiment of the grid-adequacy estimator (src/analysis/gridAdequacy): known
 * patterns evaluated on a 0.5° grid are the truth; the same patterns sampled on 5°, 7.5°, 10°
 * and 15° constant-step grids are the "units". For each, the true error of each percentile (and
 * of 1.5× and 2× coarser grids) is set against the sub-grid spread s the estimator sees.
 * Patterns: cosⁿ lobes (closed-form beams: G(ψ) = (n+1)·cosⁿψ on the front hemisphere, a −30 dB
 * floor behind, the directivity of a cosⁿ power pattern being 2(n+1) — Balanis, Antenna Theory,
 * §2.6, from memory) and the src/sim handset array (16 and 32 beams).
 */
import { buildSphereGrid } from '../../../src/sphere/buildGrid.js';
import { weightedCdf } from '../../../src/coverage/weightedCdf.js';
import { percentile } from '../../../src/coverage/percentile.js';
import { totalScanPattern } from '../../../src/coverage/totalScanPattern.js';
import { gridAdequacy } from '../../../src/analysis/gridAdequacy/gridAdequacy.js';
import { createRng, handsetModule, regularGrid, simulateBeams, type SampleGrid } from '../../../src/sim/index.js';

export type Pattern = { name: string; beams: (g: SampleGrid) => Float64Array[] };

/** K cosⁿ lobes pointing at seeded random directions, each with `powerDbm` at its peak minus its directivity spread. */
export function cosLobes(name: string, k: number, n: number, seed: number): Pattern {
  const rng = createRng(seed);
  const dirs = Array.from({ length: k }, () => {
    const z = 2 * rng.uniform() - 1, p = 2 * Math.PI * rng.uniform(), s = Math.sqrt(1 - z * z);
    return [s * Math.cos(p), s * Math.sin(p), z] as const;
  });
  const gains = dirs.map(() => 10 + 3 * rng.uniform());
  return {
    name,
    beams: (g) => dirs.map((d, b) => {
      const out = new Float64Array(g.thetaDeg.length);
      for (let i = 0; i < out.length; i++) {
        const t = (g.thetaDeg[i] * Math.PI) / 180, p = (g.phiDeg[i] * Math.PI) / 180;
        const c = Math.sin(t) * Math.cos(p) * d[0] + Math.sin(t) * Math.sin(p) * d[1] + Math.cos(t) * d[2];
        out[i] = gains[b] + 10 * Math.log10((n + 1) * Math.max(c, 0) ** n + 1e-3);
      }
      return out;
    }),
  };
}

export function handset(name: string, extraBeams: number, frequencyHz: number): Pattern {
  const { model, codebook } = handsetModule({ conductedPowerDbm: 13, extraBeams });
  return { name, beams: (g) => simulateBeams(model, codebook, g, frequencyHz).map((b) => b.eirpDbm) };
}

export const CALIBRATION_PATTERNS: Pattern[] = [
  cosLobes('4 cos^4 lobes', 4, 4, 11),
  cosLobes('8 cos^10 lobes', 8, 10, 12),
  cosLobes('16 cos^20 lobes', 16, 20, 13),
  cosLobes('24 cos^40 lobes', 24, 40, 14),
  handset('handset 16 beams 28 GHz', 0, 28e9),
  handset('handset 32 beams 26.5 GHz', 16, 26.5e9),
];
export const CALIBRATION_STEPS_DEG = [5, 7.5, 10, 15];
export const CALIBRATION_LEVELS_PCT = [5, 10, 20, 50, 80, 95];

export interface CalibrationRow { pattern: string; stepDeg: number; levelPct: number; errDb: number; err1p5Db: number; err2Db: number; spreadDb: number }

function levelsOn(p: Pattern, step: number): { grid: ReturnType<typeof buildSphereGrid>['grid']; tsp: Float64Array; values: number[] } {
  const sg = regularGrid({ thetaStepDeg: step, phiStepDeg: step, polesOnce: true });
  const built = buildSphereGrid(sg.thetaDeg, sg.phiDeg);
  const raw = p.beams(sg);
  const beams = raw.map((v) => { const o = new Float64Array(v.length); for (let j = 0; j < v.length; j++) o[built.pointOf[j]] = v[j]; return o; });
  const tsp = totalScanPattern(beams, 'eirp').values;
  const cdf = weightedCdf(tsp, built.grid.weightSr);
  return { grid: built.grid, tsp, values: CALIBRATION_LEVELS_PCT.map((l) => percentile(cdf, l, 'eirp') as number) };
}

/** Rows of the experiment (truth on a 0.5° grid). Cost: a few seconds per pattern. */
export function calibrationRows(patterns = CALIBRATION_PATTERNS, steps = CALIBRATION_STEPS_DEG): CalibrationRow[] {
  const rows: CalibrationRow[] = [];
  for (const p of patterns) {
    const truth = levelsOn(p, 0.5).values;
    for (const step of steps) {
      const unit = levelsOn(p, step);
      const c15 = levelsOn(p, step * 1.5).values;
      const c2 = levelsOn(p, step * 2).values;
      const adequacy = gridAdequacy(unit.grid, unit.tsp, 'eirp', CALIBRATION_LEVELS_PCT, [], { atStep: 1, at1p5: 1, at2: 1 });
      CALIBRATION_LEVELS_PCT.forEach((levelPct, l) => {
        rows.push({ pattern: p.name, stepDeg: step, levelPct, errDb: unit.values[l] - truth[l], err1p5Db: c15[l] - truth[l], err2Db: c2[l] - truth[l],
          spreadDb: adequacy.percentiles[l].subGridSpreadDb as number });
      });
    }
  }
  return rows;
}

/** q-quantile (step rule) of |err|/s. */
export function ratioQuantile(rows: CalibrationRow[], pick: (r: CalibrationRow) => number, q: number): number {
  const r = rows.map((x) => Math.abs(pick(x)) / Math.max(x.spreadDb, 1e-6)).sort((a, b) => a - b);
  return r[Math.min(r.length - 1, Math.ceil(q * r.length) - 1)];
}
