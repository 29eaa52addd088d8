import type { CheckResult, Measurement, Quantity, SphereGrid, TotalScanPattern, UnitResult } from '../../src/types.js';

const RAD = Math.PI / 180;

/**
 * A regular θ/φ grid with exact cell weights (test-local helper; the product code builds grids in
 * src/sphere). Cell: halfway to the neighbours, Ω = Δφ (cos θ₁ − cos θ₂); a pole row is one cap
 * point, Ω = 2π (1 − cos(Δθ/2)) (DESIGN.md, regular grid weights).
 */
export function regularTestGrid(stepDeg: number, thetaMaxDeg = 180): SphereGrid {
  const rows: number[] = [];
  for (let t = 0; t <= thetaMaxDeg + 1e-9; t += stepDeg) rows.push(t);
  const cols: number[] = [];
  for (let p = 0; p < 360 - 1e-9; p += stepDeg) cols.push(p);
  const theta: number[] = [];
  const phi: number[] = [];
  const w: number[] = [];
  const rowStart: number[] = [];
  const rowLength: number[] = [];
  const h = stepDeg / 2;
  for (const t of rows) {
    rowStart.push(theta.length);
    const t1 = Math.max(0, t - h) * RAD;
    const t2 = Math.min(180, t + h) * RAD;
    if (t === 0 || t === 180) {
      theta.push(t);
      phi.push(0);
      w.push(2 * Math.PI * (Math.cos(t1) - Math.cos(t2)) * (t === 0 ? 1 : 1));
      rowLength.push(1);
      continue;
    }
    for (const p of cols) {
      theta.push(t);
      phi.push(p);
      w.push(stepDeg * RAD * (Math.cos(t1) - Math.cos(t2)));
    }
    rowLength.push(cols.length);
  }
  const weightSr = Float64Array.from(w);
  return {
    kind: 'regular',
    thetaDeg: Float64Array.from(theta),
    phiDeg: Float64Array.from(phi),
    weightSr,
    solidAngleSr: weightSr.reduce((a, b) => a + b, 0),
    regular: {
      thetaRowsDeg: Float64Array.from(rows),
      phiColsDeg: Float64Array.from(cols),
      rowStart: Int32Array.from(rowStart),
      rowLength: Int32Array.from(rowLength),
      phiWraps: true,
    },
  };
}

function unit(thetaDeg: number, phiDeg: number): [number, number, number] {
  const t = thetaDeg * RAD;
  const p = phiDeg * RAD;
  return [Math.sin(t) * Math.cos(p), Math.sin(t) * Math.sin(p), Math.cos(t)];
}

/** 16 cosⁿ beams (invented codebook) on a grid; eis = 0 dBm-referenced mirror of eirp. */
export function testBeams(grid: SphereGrid, quantity: Quantity, count = 16): { id: string; values: Float64Array }[] {
  const dirs: [number, number][] = [];
  for (let k = 0; k < count; k++) dirs.push([40 + ((k * 37) % 100), (k * 360) / count + (k % 2) * 10]);
  return dirs.map(([bt, bp], k) => {
    const b = unit(bt, bp);
    const peak = 21 - (k % 5) * 0.7;
    const values = new Float64Array(grid.thetaDeg.length);
    for (let i = 0; i < values.length; i++) {
      const u = unit(grid.thetaDeg[i], grid.phiDeg[i]);
      const c = Math.max(0, u[0] * b[0] + u[1] * b[1] + u[2] * b[2]);
      const eirp = peak + 10 * Math.log10(Math.pow(c, 6) + 1e-3);
      values[i] = quantity === 'eis' ? -75 - eirp : eirp;
    }
    return { id: `b${k}`, values };
  });
}

export function makeMeasurement(opts: { quantity?: Quantity; thetaMaxDeg?: number; beams?: number; unit?: string } = {}): Measurement {
  const quantity = opts.quantity ?? 'eirp';
  const grid = regularTestGrid(5, opts.thetaMaxDeg ?? 180);
  const beams = testBeams(grid, quantity, opts.beams ?? 16);
  return {
    unit: opts.unit ?? 'QX-07',
    frequencyHz: 28e9,
    quantity,
    valueUnit: 'dBm',
    grid,
    beams,
    sources: beams.map((b) => ({ path: `QX-07/${b.id}_28GHz.csv`, sha256: 'ab12cd34ef56' + '0'.repeat(52) })),
    warnings: [{ code: 'duplicate-merged', message: 'φ = 360° samples merged into φ = 0°' }],
    metadata: {},
  };
}

export function makeTsp(m: Measurement): TotalScanPattern {
  const n = m.grid.thetaDeg.length;
  const values = new Float64Array(n);
  const bestBeam = new Int32Array(n);
  const eis = m.quantity === 'eis';
  for (let i = 0; i < n; i++) {
    let best = 0;
    for (let b = 1; b < m.beams.length; b++) {
      const v = m.beams[b].values[i];
      if (eis ? v < m.beams[best].values[i] : v > m.beams[best].values[i]) best = b;
    }
    values[i] = m.beams[best].values[i];
    bestBeam[i] = best;
  }
  return { values, bestBeam };
}

/** Test-local step percentile over 4π (unmeasured counts as worst), to fill the UnitResult. */
function percentile(values: Float64Array, w: Float64Array, p: number, eis: boolean): number | null {
  const idx = Array.from(values.keys()).sort((a, b) => values[a] - values[b]);
  const total = 4 * Math.PI;
  let cum = eis ? 0 : total - w.reduce((a, b) => a + b, 0);
  if (cum / total >= p / 100 && !eis) return p === 0 ? values[idx[0]] : null;
  for (const i of idx) {
    cum += w[i];
    if (cum / total >= p / 100 - 1e-12) return values[i];
  }
  return null;
}

export function makeResult(m: Measurement, tsp: TotalScanPattern, verdictPass = true): UnitResult {
  const eis = m.quantity === 'eis';
  const w = m.grid.weightSr;
  const better = (v: number, t: number) => (eis ? v <= t : v >= t);
  let pk = 0;
  for (let i = 0; i < tsp.values.length; i++) if (better(tsp.values[i], tsp.values[pk]) && tsp.values[i] !== tsp.values[pk]) pk = i;
  const share = (pred: (i: number) => boolean) => {
    let s = 0;
    for (let i = 0; i < w.length; i++) if (pred(i)) s += w[i];
    return s / (4 * Math.PI);
  };
  const levels = [0, 5, 10, 20, 50, 80, 90, 95, 100];
  const percentiles = levels.map((p) => ({ levelPct: p, value: percentile(tsp.values, w, p, eis) }));
  const thr = eis ? -88 : 10;
  const coverage = [{ threshold: thr, efficiency: share((i) => better(tsp.values[i], thr)) }];
  const peak = { value: tsp.values[pk], thetaDeg: m.grid.thetaDeg[pk], phiDeg: m.grid.phiDeg[pk] };
  const curve = Array.from({ length: 41 }, (_, k) => {
    const t = peak.value + (eis ? 1 : -1) * k;
    return { threshold: t, efficiency: share((i) => better(tsp.values[i], t)) };
  }).sort((a, b) => a.threshold - b.threshold);
  const relativeCoverage = [3, 6].map((d) => {
    const t = eis ? peak.value + d : peak.value - d;
    return { threshold: t, dbBelowPeak: d, efficiency: share((i) => better(tsp.values[i], t)) };
  });
  const p50 = percentiles.find((p) => p.levelPct === 50)!.value!;
  const lim50 = eis ? p50 + (verdictPass ? 1.25 : -1.25) : p50 + (verdictPass ? -1.25 : 1.25);
  const checks: CheckResult[] = [
    {
      name: 'EIRP at 50 %', kind: 'percentile', value: p50, limit: lim50, toleranceDb: 0, effectiveLimit: lim50,
      margin: eis ? lim50 - p50 : p50 - lim50, pass: verdictPass, status: verdictPass ? 'pass' : 'fail', levelPct: 50, marginUnit: 'dB', bound: eis ? 'upper' : 'lower',
    },
    {
      name: 'Peak EIRP', kind: 'min-peak', value: peak.value, limit: peak.value - 3.4, toleranceDb: 0.5, effectiveLimit: peak.value - 3.9,
      margin: 3.9, pass: true, status: 'pass', marginUnit: 'dB', bound: 'lower',
    },
    {
      name: 'Coverage at 10 dBm', kind: 'min-coverage', value: coverage[0].efficiency, limit: 0.4, toleranceDb: 0, effectiveLimit: 0.4,
      margin: coverage[0].efficiency - 0.4, pass: coverage[0].efficiency >= 0.4, status: coverage[0].efficiency >= 0.4 ? 'pass' : 'fail', threshold: thr, marginUnit: 'fraction',
    },
  ];
  const anyFail = checks.some((c) => c.status === 'fail');
  return {
    unit: m.unit,
    frequencyHz: m.frequencyHz,
    quantity: m.quantity,
    valueUnit: m.valueUnit,
    solidAngleSr: m.grid.solidAngleSr,
    beams: m.beams.map((b, k) => {
      let bp = 0;
      for (let i = 0; i < b.values.length; i++) if (better(b.values[i], b.values[bp]) && b.values[i] !== b.values[bp]) bp = i;
      return {
        id: b.id,
        peak: { value: b.values[bp], thetaDeg: m.grid.thetaDeg[bp], phiDeg: m.grid.phiDeg[bp] },
        trpDbm: eis ? null : 10 * Math.log10(b.values.reduce((s, v, i) => s + w[i] * Math.pow(10, v / 10), 0) / (4 * Math.PI)),
        bestShare: share((i) => tsp.bestBeam[i] === k),
      };
    }),
    tsp: { peak, percentiles, coverage, relativeCoverage, curve },
    checks,
    verdict: anyFail ? 'fail' : 'pass',
    worstCheck: { name: 'EIRP at 50 %', margin: checks[0].margin! },
    warnings: m.warnings.map((x) => x.message),
    grid: {
      kind: 'regular', points: m.grid.thetaDeg.length, thetaRangeDeg: [0, m.grid.regular!.thetaRowsDeg.at(-1)!], phiRangeDeg: [0, 355],
      thetaStepDeg: 5, phiStepDeg: 5, fullSphere: Math.abs(m.grid.solidAngleSr - 4 * Math.PI) < 1e-9, solidAngleSr: m.grid.solidAngleSr, duplicatesMerged: 72, beamsResampled: 0,
    },
    sources: m.sources,
    limitSet: { name: 'example-programme', source: 'templates/limits/example.yaml' },
  };
}
