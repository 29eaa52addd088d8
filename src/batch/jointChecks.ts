/**
 * Checks that join two measurements of one unit, judged after every measurement of the unit's
 * group is measured (they start 'not evaluable' in evaluateCheck):
 *
 * - beam-correspondence: the unit's EIRP export and its EIS export of the same codebook at the
 *   same frequency. Pairing: the same unit name (the unit's folder, a unit column, identity.unit
 *   of the job file, or a file stem that differs only by a tx/rx token) and the same frequency;
 *   the quantity of each export comes from its value column (eirp_* / eis_*). Beams pair by id.
 * - inter-band-coverage: the unit's EIRP exports at two frequencies, one inside each band's
 *   frequency range.
 */
import type { CheckResult, Measurement, Polarization, UnitResult } from '../types.js';
import type { BeamCorrespondenceCheck, InterBandCheck, LimitSet } from '../limits/limitSet.js';
import { summarizeChecks } from '../limits/judge.js';
import { snap } from '../limits/evaluateCheck.js';
import { beamCorrespondence } from '../coverage/beamCorrespondence.js';
import { combinedSensitivityArrays } from '../coverage/combinedSensitivity.js';
import { jointCoverage } from '../coverage/jointCoverage.js';
import { weightedCdf } from '../coverage/weightedCdf.js';
import { resampleBeam } from '../sphere/resample.js';
import type { MeasuredUnit } from './polarizationUnits.js';

/** Per-direction data of the joint checks, for the unit's PDF (not in results.json). */
export interface JointMaps {
  interBand?: { inA: Uint8Array; inB: Uint8Array; names: [string, string] };
}

const sameGrid = (a: Measurement, b: Measurement): boolean =>
  a.grid === b.grid || (a.grid.thetaDeg.length === b.grid.thetaDeg.length
    && a.grid.thetaDeg.every((t, i) => t === b.grid.thetaDeg[i] && a.grid.phiDeg[i] === b.grid.phiDeg[i]));

/** Values of `from` on the grid of `to` (as they are when the grids coincide). */
function onGrid(from: Measurement, values: Float64Array, to: Measurement): Float64Array {
  return sameGrid(from, to) ? values : resampleBeam(from.grid, values, to.grid).values;
}

/** At most ~200 points of a CDF normalized to its own total (for the report). */
function compactCdf(values: number[], weights: number[]): { valuesDb: number[]; fractions: number[] } {
  const cdf = weightedCdf(values, weights);
  const n = cdf.values.length;
  const step = Math.max(1, Math.ceil(n / 200));
  const valuesDb: number[] = [];
  const fractions: number[] = [];
  for (let k = 0; k < n; k += step) { valuesDb.push(cdf.values[k]); fractions.push(cdf.cumulativeSr[k] / cdf.measuredSr); }
  if ((n - 1) % step !== 0 && n > 0) { valuesDb.push(cdf.values[n - 1]); fractions.push(1); }
  return { valuesDb, fractions };
}

function judged(c: CheckResult, value: number, note?: string): CheckResult {
  const margin = snap(c.bound === 'upper' ? c.effectiveLimit - value : value - c.effectiveLimit);
  const pass = margin >= 0;
  const { note: _old, ...rest } = c;
  return { ...rest, value, margin, pass, status: pass ? 'pass' : 'fail', ...(note ? { note } : {}) };
}

function rejudge(r: UnitResult): void {
  const s = summarizeChecks(r.checks);
  r.verdict = s.verdict;
  r.worstCheck = s.worstCheck;
}

/** The receive patterns used for the device's beam choice: the combined sensitivity of a θ/φ pair, else the EIS values. */
function receiveBeams(rx: MeasuredUnit): { m: Measurement; beams: Map<string, Float64Array>; basis: 'eis' | 'combined-sensitivity' } {
  const comps = rx.components ?? [];
  if (comps.length === 2 && sameGrid(comps[0], comps[1])) {
    const [a, b] = comps;
    const beams = new Map<string, Float64Array>();
    for (const x of a.beams) {
      const y = b.beams.find((z) => z.id === x.id);
      if (y) beams.set(x.id, combinedSensitivityArrays(x.values, y.values));
    }
    return { m: a, beams, basis: 'combined-sensitivity' };
  }
  return { m: rx.m, beams: new Map(rx.m.beams.map((x) => [x.id, x.values])), basis: 'eis' };
}

function applyBeamCorrespondence(tx: MeasuredUnit, k: number, spec: BeamCorrespondenceCheck, all: MeasuredUnit[]): void {
  const r = tx.result;
  const rx = all.find((u) => u !== tx && u.result.unit === r.unit && u.result.frequencyHz === r.frequencyHz && u.result.quantity === 'eis');
  if (!rx) return;
  const rec = receiveBeams(rx);
  const txIds = tx.m.beams.map((b) => b.id);
  const missing = [...rec.beams.keys()].filter((id) => !txIds.includes(id));
  if (missing.length) {
    r.checks[k] = { ...r.checks[k], note: `receive beam(s) ${missing.join(', ')} have no transmit (EIRP) export of the same id` };
    return;
  }
  const n = tx.m.grid.thetaDeg.length;
  const never = new Float64Array(n).fill(Infinity); // a transmit beam without a receive export is never the receive choice
  const eis = tx.m.beams.map((b) => (rec.beams.has(b.id) ? onGrid(rec.m, rec.beams.get(b.id) as Float64Array, tx.m) : never));
  const bc = beamCorrespondence(tx.m.grid.weightSr, tx.m.beams.map((b) => b.values), eis, spec.levelPct, spec.topSharePct);
  if (bc.value === null) {
    r.checks[k] = { ...r.checks[k], note: `the upper ${spec.topSharePct} % of the total scan pattern is not evaluable (partial sphere)` };
    return;
  }
  const d: number[] = [];
  const w: number[] = [];
  for (let i = 0; i < n; i++) if (bc.inRegion[i]) { d.push(bc.deltaDb[i]); w.push(tx.m.grid.weightSr[i]); }
  let beamsOff = 0;
  for (let i = 0; i < n; i++) if (bc.inRegion[i] && bc.deltaDb[i] > 0) beamsOff += tx.m.grid.weightSr[i];
  r.checks[k] = judged(r.checks[k], bc.value,
    `receive export of unit ${rx.result.unit}; beam choice from ${rec.basis === 'combined-sensitivity' ? 'the combined sensitivity of its θ/φ pair' : 'its EIS'}${sameGrid(rec.m, tx.m) ? '' : ' (resampled onto the transmit grid)'}`);
  r.beamCorrespondence = {
    levelPct: spec.levelPct, topSharePct: spec.topSharePct, valueDb: bc.value,
    regionSr: bc.regionSr, regionFloorDbm: bc.regionFloorDbm, rxChoiceBasis: rec.basis,
    resampled: !sameGrid(rec.m, tx.m), otherBeamShareOfRegion: beamsOff / bc.regionSr, cdf: compactCdf(d, w),
  };
  rx.result.warnings.push(`used as the receive side of unit ${r.unit}'s beam correspondence (ΔEIRP_BC ${bc.value.toFixed(2)} dB)`);
}

function applyInterBand(u: MeasuredUnit, k: number, spec: InterBandCheck, all: MeasuredUnit[], maps: Map<MeasuredUnit, JointMaps>): void {
  const r = u.result;
  const inBand = (x: MeasuredUnit, j: 0 | 1): boolean => {
    const f = x.result.frequencyHz;
    const [lo, hi] = spec.bands[j].frequencyRangeMHz;
    return f !== null && f >= lo * 1e6 && f <= hi * 1e6;
  };
  const own = all.filter((x) => x.result.unit === r.unit && x.result.quantity === 'eirp');
  const a = own.find((x) => inBand(x, 0));
  const b = own.find((x) => inBand(x, 1));
  if (!a || !b || (u !== a && u !== b)) return;
  const tol = spec.toleranceDb;
  const levelA = snap(spec.bands[0].limit - spec.deltaDb - tol);
  const levelB = snap(spec.bands[1].limit - spec.deltaDb - tol);
  const tspB = onGrid(b.m, b.tsp.values, a.m);
  const j = jointCoverage(a.m.grid.weightSr, a.tsp.values, levelA, tspB, levelB);
  const other = u === a ? b : a;
  r.checks[k] = judged(r.checks[k], snap(j.share),
    `with ${other.result.frequencyHz === null ? 'its other band' : `${other.result.frequencyHz / 1e9} GHz`}; levels ${levelA} and ${levelB} dBm (band level − ΔT_IB,S,n ${spec.deltaDb} dB${tol ? ` − tolerance ${tol} dB` : ''})`);
  r.interBand = {
    bands: [
      { name: spec.bands[0].name, frequencyHz: a.result.frequencyHz as number, levelDbm: levelA, share: j.shareA },
      { name: spec.bands[1].name, frequencyHz: b.result.frequencyHz as number, levelDbm: levelB, share: j.shareB },
    ],
    jointShare: j.share, requiredShare: snap(1 - spec.levelPct / 100), resampled: !sameGrid(a.m, b.m),
  };
  // The map is drawn on this unit's grid.
  const inA = u === a ? j.inA : Uint8Array.from(onGrid(a.m, Float64Array.from(j.inA), b.m), (v) => (v >= 0.5 ? 1 : 0));
  const inB = u === a ? j.inB : Uint8Array.from(b.tsp.values, (v) => (v >= levelB ? 1 : 0));
  maps.set(u, { ...(maps.get(u) ?? {}), interBand: { inA, inB, names: [spec.bands[0].name, spec.bands[1].name] } });
}

/**
 * Judge the joint checks of one group's measured units in place (checks, verdict, worst check,
 * and the results' beamCorrespondence / interBand blocks). A unit without its partner keeps the
 * check 'not evaluable' with a note that says what is missing.
 * @returns per-direction data for the PDFs.
 */
export function applyJointChecks(all: MeasuredUnit[], ls: LimitSet | null): Map<MeasuredUnit, JointMaps> {
  const maps = new Map<MeasuredUnit, JointMaps>();
  if (!ls) return maps;
  for (const u of all) {
    if (u.result.quantity !== 'eirp' || ls.quantity !== 'eirp') continue;
    let touched = false;
    ls.checks.forEach((spec, k) => {
      if (u.result.checks[k]?.name !== spec.name) return;
      if (spec.kind === 'beam-correspondence') { applyBeamCorrespondence(u, k, spec, all); touched = true; }
      if (spec.kind === 'inter-band-coverage') { applyInterBand(u, k, spec, all, maps); touched = true; }
    });
    if (touched) rejudge(u.result);
  }
  // A receive export analyzed beside its transmit export under a transmit limit set is not
  // judged by that set (its checks would all be "limit set is for eirp"): it is reported unjudged.
  for (const u of all) {
    const pairedTx = all.some((t) => t.result.quantity === 'eirp' && t.result.unit === u.result.unit && t.result.frequencyHz === u.result.frequencyHz);
    if (u.result.quantity === 'eis' && ls.quantity === 'eirp' && pairedTx) {
      u.result.checks = [];
      u.result.verdict = 'none';
      u.result.worstCheck = null;
      u.result.warnings = u.result.warnings.filter((w) => !w.startsWith(`limit set '${ls.name}' is for eirp`));
    }
  }
  return maps;
}

export type { Polarization };
