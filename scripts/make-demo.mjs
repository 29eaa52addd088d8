// Generates fixtures/demo: an invented prototype build (six units) of a 28 GHz handset antenna
// module, measured over the sphere on a 5° grid, exported in a mix of file layouts, plus the job
// file. Run `npm run demo:regen` (builds dist/ first). Deterministic: fixed seeds throughout.
// Ends with a self-check that recomputes each unit's 50 %-tile and peak EIRP with its own
// regular-grid cell weights and checks the scenario's intended pass/fail pattern.
import { mkdir, rm, writeFile, readdir, stat } from 'node:fs/promises';
import { dirname, join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';
import {
  applyMeasurementNoise, failElement, formatExport, handsetModule, perturbElements, regularGrid, simulateBeams, writeExport,
} from '../dist/sim/index.js';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
const OUT = join(ROOT, 'fixtures', 'demo');
const STEP_DEG = 5;
const F_MAIN_HZ = 28e9;
const F_SECOND_HZ = 29e9;
const CONDUCTED_DBM = 8.9; // total conducted power of a beam, split over its 4 elements
const BACK_LOBE_FLOOR_DB = -20;
const SPREAD = { amplitudeSigmaDb: 0.3, phaseSigmaDeg: 5 }; // production spread of every RF chain
const NOISE = { sigmaDb: 0.15, noiseFloorDbm: -30 };
const LIMIT_PCTL_DBM = 11.5; // 3GPP FR2 PC3 n257 spherical coverage (reference file, S1 6.2.1.3)
const LIMIT_PEAK_DBM = 22.4; // 3GPP FR2 PC3 n257 minimum peak EIRP (reference file, S1 6.2.1.3)
/** Programme checks of the invented programme (job file): share of 4π at or above a threshold. */
const PROGRAMME = [
  { thresholdDbm: 8, minEfficiency: 0.55 },
  { thresholdDbm: 14, minEfficiency: 0.45 },
];

/** The build. `defect` is what makes a unit special; every unit has its own production spread. */
const UNITS = [
  { serial: 'RV28-P1-001', seed: 101, layout: 'per-beam-long', freqs: [F_MAIN_HZ], defect: null },
  { serial: 'RV28-P1-002', seed: 102, layout: 'single-long', freqs: [F_MAIN_HZ, F_SECOND_HZ], defect: null },
  { serial: 'RV28-P1-003', seed: 103, layout: 'az-el', freqs: [F_MAIN_HZ], defect: 'phase-cal' },
  { serial: 'RV28-P1-004', seed: 304, layout: 'semicolon', freqs: [F_MAIN_HZ], defect: 'failed-element' },
  { serial: 'RV28-P1-005', seed: 505, layout: 'matrix', freqs: [F_MAIN_HZ, F_SECOND_HZ], defect: null },
  { serial: 'RV28-P1-006', seed: 106, layout: 'pol-pair', freqs: [F_MAIN_HZ], defect: null },
];
/** Edge sub-array element whose feed is open on unit 004 (elements 4..7 are the edge 1×4). */
const FAILED_ELEMENT = 5;
/** Stale phase-calibration table on unit 003's edge sub-array, degrees per element 4..7. */
const PHASE_CAL_ERROR_DEG = [0, 40, -30, 50];

const ghz = (f) => `${f / 1e9}GHz`;
const round2 = (x) => Math.round(x * 100) / 100;

function unitModel(u) {
  const { model, codebook } = handsetModule({ conductedPowerDbm: CONDUCTED_DBM, floorDb: BACK_LOBE_FLOOR_DB });
  let elements = perturbElements(model.elements, { amplitudeSigmaDb: SPREAD.amplitudeSigmaDb, phaseSigmaDeg: SPREAD.phaseSigmaDeg, seed: u.seed });
  if (u.defect === 'failed-element') elements = failElement(elements, FAILED_ELEMENT);
  if (u.defect === 'phase-cal') {
    elements = elements.map((e, i) => (i >= 4 ? { ...e, phaseErrorDeg: e.phaseErrorDeg + PHASE_CAL_ERROR_DEG[i - 4] } : e));
  }
  return { model: { ...model, elements }, codebook };
}

/** Sample grid a unit's files are written on, and the unique-direction index of each sample. */
function writtenGrid(unique, opts) {
  const g = regularGrid({ thetaStepDeg: STEP_DEG, phiStepDeg: STEP_DEG, ...opts });
  const key = (t, p) => (t === 0 || t === 180 ? `${t}` : `${t}|${((p % 360) + 360) % 360}`);
  const index = new Map();
  for (let i = 0; i < unique.thetaDeg.length; i++) index.set(key(unique.thetaDeg[i], unique.phiDeg[i]), i);
  const map = Int32Array.from(g.thetaDeg, (t, i) => index.get(key(t, g.phiDeg[i])));
  return { grid: g, map };
}

/** Values as a file of 2-decimal dB numbers holds them (the pol pair keeps its components). */
function asWritten(beam, map, polPair) {
  const pick = (a) => Float64Array.from(map, (i) => round2(a[i]));
  const thetaDb = pick(beam.eirpThetaDbm);
  const phiDb = pick(beam.eirpPhiDbm);
  const valuesDb = polPair
    ? Float64Array.from(thetaDb, (t, i) => 10 * Math.log10(10 ** (t / 10) + 10 ** (phiDb[i] / 10)))
    : pick(beam.eirpDbm);
  return { id: beam.id, valuesDb, thetaDb, phiDb };
}

const META = { source: 'spherecov demo generator (simulated, invented device)' };

async function writeUnit(u, freqHz, beams, unique) {
  const dir = join(OUT, u.serial);
  const tag = ghz(freqHz);
  const perBeam = async (name, gridOpts, opts, polPair = false) => {
    const { grid, map } = writtenGrid(unique, gridOpts);
    for (const b of beams) {
      await writeExport(join(dir, name(b.id)), { grid, beams: [asWritten(b, map, polPair)] }, { beamColumn: false, ...opts });
    }
    return { grid, map };
  };
  switch (u.layout) {
    case 'per-beam-long': // chamber default: poles written at every φ, φ 0..355
      return perBeam((id) => `beam_${id}_${tag}.csv`, {}, { layout: 'long', metadata: META });
    case 'az-el': // positioner in azimuth/elevation, az −180..175
      return perBeam((id) => `azel_b${id}_${tag}.csv`, { phiConvention: '-180-180' }, { layout: 'az-el', metadata: META });
    case 'semicolon': // a spreadsheet export in a decimal-comma locale
      return perBeam((id) => `${u.serial}_beam-${id}_${tag}.txt`, { polesOnce: true },
        { layout: 'long', delimiter: ';', decimalComma: true, lineEnding: '\r\n' });
    case 'matrix':
      return perBeam((id) => `beam${id}_${tag}.csv`, {}, { layout: 'matrix', metadata: META });
    case 'pol-pair': // both polarizations, φ seam written twice (0 and 360)
      return perBeam((id) => `${u.serial}_beam_${id}_${tag}.csv`, { phiConvention: '0-360-inclusive' },
        { layout: 'pol-pair', metadata: META }, true);
    default:
      throw new Error(`unknown layout ${u.layout}`);
  }
}

/** Single long file holding every beam of both frequencies of one unit (a database dump). */
async function writeSingleLong(u, perFreq, unique) {
  const { grid, map } = writtenGrid(unique, { polesOnce: true });
  const path = join(OUT, u.serial, `${u.serial}_all-beams.csv`);
  await mkdir(dirname(path), { recursive: true });
  // Frequencies are stacked in one file: write the first with a header, append the rest.
  let text = '';
  for (const [k, { freqHz, beams }] of perFreq.entries()) {
    const s = formatExport({ grid, beams: beams.map((b) => asWritten(b, map, false)) },
      { layout: 'long', beamColumn: true, frequencyHz: freqHz, metadata: k === 0 ? META : {} });
    text += k === 0 ? s : s.slice(s.indexOf('\n') + 1);
  }
  await writeFile(path, text);
  return { grid, map };
}

// ---- self-check: own regular-grid weights, TSP, step percentile (CONTRACT.md semantics) ----

/** Cell solid angle of each unique direction of a full θ/φ grid: Δφ(cos θ₁ − cos θ₂); poles are caps. */
function cellWeights(g) {
  const r = Math.PI / 180;
  const h = STEP_DEG / 2;
  return Float64Array.from(g.thetaDeg, (t) =>
    t === 0 || t === 180 ? 2 * Math.PI * (1 - Math.cos(h * r)) : STEP_DEG * r * (Math.cos((t - h) * r) - Math.cos((t + h) * r)));
}

/** Unique-direction values of what a file holds (duplicates in the file are equal by construction). */
function uniqueValues(written, map, n) {
  const v = new Float64Array(n).fill(NaN);
  for (let i = 0; i < map.length; i++) v[map[i]] = written[i];
  return v;
}

function metricsOf(beamValues, w) {
  const n = w.length;
  const tsp = new Float64Array(n).fill(-Infinity);
  for (const v of beamValues) for (let i = 0; i < n; i++) if (v[i] > tsp[i]) tsp[i] = v[i];
  const order = Array.from(tsp.keys()).sort((a, b) => tsp[a] - tsp[b]);
  const total = 4 * Math.PI;
  const pctl = (p) => {
    let c = 0;
    for (const i of order) {
      c += w[i];
      if (c >= (p / 100) * total * (1 - 1e-12)) return tsp[i];
    }
    return tsp[order[order.length - 1]];
  };
  const cover = (t) => order.reduce((s, i) => s + (tsp[i] >= t ? w[i] : 0), 0) / total;
  return {
    peakDbm: Math.max(...tsp), p50Dbm: pctl(50), p20Dbm: pctl(20), p80Dbm: pctl(80),
    coverage: PROGRAMME.map((c) => cover(c.thresholdDbm)), weightSumSr: w.reduce((a, b) => a + b, 0),
  };
}

async function dirSize(d) {
  let s = 0;
  for (const e of await readdir(d, { withFileTypes: true })) {
    const p = join(d, e.name);
    s += e.isDirectory() ? await dirSize(p) : (await stat(p)).size;
  }
  return s;
}

async function main() {
  for (const u of UNITS) await rm(join(OUT, u.serial), { recursive: true, force: true });
  await mkdir(OUT, { recursive: true });
  const unique = regularGrid({ thetaStepDeg: STEP_DEG, phiStepDeg: STEP_DEG, polesOnce: true });
  const w = cellWeights(unique);
  const expected = [];
  for (const u of UNITS) {
    const { model, codebook } = unitModel(u);
    const perFreq = u.freqs.map((freqHz, k) => ({
      freqHz,
      beams: applyMeasurementNoise(simulateBeams(model, codebook, unique, freqHz), { ...NOISE, seed: u.seed * 10 + k }),
    }));
    const written = [];
    if (u.layout === 'single-long') {
      const gm = await writeSingleLong(u, perFreq, unique);
      for (const pf of perFreq) written.push({ ...pf, ...gm });
    } else {
      for (const pf of perFreq) written.push({ ...pf, ...(await writeUnit(u, pf.freqHz, pf.beams, unique)) });
    }
    for (const { freqHz, beams, map } of written) {
      const vals = beams.map((b) => uniqueValues(asWritten(b, map, u.layout === 'pol-pair').valuesDb, map, unique.thetaDeg.length));
      expected.push({ unit: u.serial, frequencyHz: freqHz, defect: u.defect, layout: u.layout, ...metricsOf(vals, w) });
    }
  }
  await writeFile(join(OUT, 'spherecov.yaml'), JOB_FILE);
  const rounded = expected.map((e) => ({
    unit: e.unit, frequencyHz: e.frequencyHz, layout: e.layout, defect: e.defect,
    peakDbm: round2(e.peakDbm), p50Dbm: round2(e.p50Dbm), p20Dbm: round2(e.p20Dbm), p80Dbm: round2(e.p80Dbm),
    coverage: e.coverage.map((x, k) => ({ thresholdDbm: PROGRAMME[k].thresholdDbm, efficiency: Math.round(x * 1e4) / 1e4 })),
  }));
  await writeFile(join(OUT, 'expected-metrics.json'), JSON.stringify({
    note: 'Self-check of scripts/make-demo.mjs: regular-grid cell weights, TSP = best beam, step percentile '
      + '(smallest value whose weighted CDF over 4π reaches p). Not produced by spherecov.',
    units: rounded,
  }, null, 2) + '\n');
  console.table(rounded.map(({ coverage, ...r }) => ({ ...r, ...Object.fromEntries(coverage.map((c) => [`≥${c.thresholdDbm}`, c.efficiency])) })));
  selfCheck(expected);
  console.log(`fixtures/demo: ${(await dirSize(OUT) / 1e6).toFixed(2)} MB in ${relative(ROOT, OUT)}`);
}

/** The scenario's intended outcome; the script fails loudly if a parameter change breaks it. */
function selfCheck(expected) {
  const problems = [];
  for (const e of expected) {
    if (Math.abs(e.weightSumSr - 4 * Math.PI) > 1e-9) problems.push(`${e.unit}: weights sum to ${e.weightSumSr}`);
    const passes = e.p50Dbm >= LIMIT_PCTL_DBM && e.peakDbm >= LIMIT_PEAK_DBM;
    if (e.defect === 'failed-element') {
      if (e.p50Dbm >= LIMIT_PCTL_DBM - 0.1) problems.push(`${e.unit}: 50 %-tile ${e.p50Dbm} should miss ${LIMIT_PCTL_DBM}`);
      if (e.peakDbm < LIMIT_PEAK_DBM + 1) problems.push(`${e.unit}: peak ${e.peakDbm} should still pass`);
      if (e.coverage[1] >= PROGRAMME[1].minEfficiency) problems.push(`${e.unit}: should miss the programme's ≥ 14 dBm share`);
    } else if (!passes || e.p50Dbm < LIMIT_PCTL_DBM + 0.5 || e.peakDbm < LIMIT_PEAK_DBM + 1.5) {
      problems.push(`${e.unit} @ ${ghz(e.frequencyHz)}: should pass with margin (50 %-tile ${e.p50Dbm}, peak ${e.peakDbm})`);
    } else if (e.coverage.some((x, k) => x < PROGRAMME[k].minEfficiency)) {
      problems.push(`${e.unit} @ ${ghz(e.frequencyHz)}: should pass the programme checks`);
    }
  }
  const ref = expected.find((e) => e.unit === 'RV28-P1-001');
  const cal = expected.find((e) => e.defect === 'phase-cal');
  if (!(cal.p50Dbm < ref.p50Dbm - 0.4)) problems.push(`phase-cal unit should lose margin against the reference`);
  if (problems.length > 0) throw new Error(`demo self-check failed:\n  ${problems.join('\n  ')}`);
}

const JOB_FILE = `# Job file of the spherecov demo build (invented device; see README.md in this folder).
# Shipped limit profile plus programme-specific coverage checks of the invented programme.
limits: 3gpp-fr2-pc3-n257
checks:
${PROGRAMME.map((c) => `  - { kind: min-coverage, threshold: ${c.thresholdDbm}, min_efficiency: ${c.minEfficiency}, name: "programme: ${Math.round(c.minEfficiency * 100)} % of sphere ≥ ${c.thresholdDbm} dBm" }`).join('\n')}
reference: RV28-P1-001
test_info:
  chamber: CATR-2 (invented)
  operator: D. Demo
  date_measured: 2026-11-30
  dut_description: RV28 prototype build P1, 28 GHz module (invented, simulated)
  notes: Simulated measurements from src/sim; nothing here was measured.
`;

await main();
