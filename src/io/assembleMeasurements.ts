import { compareBeamIds } from './compareBeamIds.js';
import { createMeasurement } from '../measurement.js';
import { buildSphereGrid, type GridBuild } from '../sphere/buildGrid.js';
import { gridWarnings } from '../sphere/gridWarnings.js';
import { mergeSamples } from '../sphere/mergeSamples.js';
import { CONFLICT_DB, mergeByOrder, mergeConflicts, mergedGroups, type MergeRule } from '../sphere/mergeConflicts.js';
import { resampleBeam } from '../sphere/resample.js';
import type { BeamPattern, InputError, Measurement, SourceFile, Warning } from '../types.js';
import { warning } from '../warnings.js';
import { inputError } from './inputError.js';
import type { RawBeam } from './types.js';

/**
 * A beam on another grid is resampled onto the unit's grid only when every unit grid point
 * lies within this angle of the beam's own samples; farther, the beam is refused (our choice:
 * about one 5° chamber step, where bilinear dB interpolation is still trustworthy).
 */
export const MAX_RESAMPLE_DISTANCE_DEG = 5;

interface AngleSet {
  thetaDeg: Float64Array;
  phiDeg: Float64Array;
  beams: RawBeam[];
}

export interface AssembleOptions {
  /**
   * Let assembly reuse the raw beams' value storage for the merged values (the raw `values`
   * become empty arrays). For callers that do not read raw values afterwards (the batch).
   */
  consumeRaw?: boolean;
  /**
   * How coincident samples (φ seam, poles, repeated rows) become one value (job file
   * `merge_rule`): power average (default), the first or last sample in file order, or refuse
   * the unit when any merge spreads by more than CONFLICT_DB.
   */
  mergeRule?: MergeRule;
}

export interface AssembleResult {
  measurements: Measurement[];
  errors: InputError[];
  warnings: Warning[];
}

function sameAngles(a: AngleSet, b: RawBeam): boolean {
  if (a.thetaDeg === b.thetaDeg && a.phiDeg === b.phiDeg) return true;
  const n = a.thetaDeg.length;
  if (n !== b.thetaDeg.length) return false;
  for (let i = 0; i < n; i++) if (a.thetaDeg[i] !== b.thetaDeg[i] || a.phiDeg[i] !== b.phiDeg[i]) return false;
  return true;
}

function sameGrid(a: GridBuild, b: GridBuild): boolean {
  const ga = a.grid;
  const gb = b.grid;
  if (ga.thetaDeg.length !== gb.thetaDeg.length) return false;
  for (let i = 0; i < ga.thetaDeg.length; i++) {
    if (Math.abs(ga.thetaDeg[i] - gb.thetaDeg[i]) > 1e-9 || Math.abs(ga.phiDeg[i] - gb.phiDeg[i]) > 1e-9) return false;
  }
  return true;
}

/**
 * Rows that literally repeat a direction (same θ and φ as written, not a pole or seam alias):
 * pairs (row, first row of its point) in row order, found once per angle set since they depend
 * on angles only; only the build's merged points are looked at (mergedGroups).
 */
function literalDuplicatePairs(build: GridBuild, s: AngleSet): Int32Array {
  const { start, samples } = mergedGroups(build);
  const found: [number, number][] = [];
  for (let g = 0; g + 1 < start.length; g++) {
    const j = samples[start[g]];
    for (let q = start[g] + 1; q < start[g + 1]; q++) {
      const i = samples[q];
      if (s.thetaDeg[i] === s.thetaDeg[j] && s.phiDeg[i] === s.phiDeg[j]) found.push([i, j]);
    }
  }
  found.sort((x, y) => x[0] - y[0]);
  return Int32Array.from(found.flat());
}

/** Count and largest value difference of one beam's literal duplicate rows (pairs in row order). */
function literalDuplicates(pairs: Int32Array, b: RawBeam): { count: number; maxDiffDb: number; at: string } {
  let maxDiffDb = 0;
  let at = '';
  for (let k = 0; k < pairs.length; k += 2) {
    const i = pairs[k];
    const d = Math.abs(b.values[i] - b.values[pairs[k + 1]]);
    if (d > maxDiffDb || at === '') {
      if (d >= maxDiffDb) at = `θ ${b.thetaDeg[i]}°, φ ${b.phiDeg[i]}°`;
      maxDiffDb = Math.max(maxDiffDb, d);
    }
  }
  return { count: pairs.length / 2, maxDiffDb, at };
}

/**
 * Merge one raw beam onto its grid. Unless its values are in `keep` (not consumable, or
 * shared), the merged values reuse their storage where the row order allows it (mergeSamples'
 * in-place route) and the RawBeam's `values` is emptied, so a big export is never held twice.
 */
function mergeConsuming(build: GridBuild, b: RawBeam, keep: Set<Float64Array>, rule: MergeRule = 'power-average'): Float64Array {
  if (rule === 'first' || rule === 'last') return mergeByOrder(build, b.values, rule);
  const r = mergeSamples(build, b.values, !keep.has(b.values));
  if (r.inPlace) b.values = EMPTY;
  return r.values;
}

const EMPTY = new Float64Array(0);

function gridText(g: GridBuild): string {
  const t = g.grid.thetaDeg;
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < t.length; i++) [lo, hi] = [Math.min(lo, t[i]), Math.max(hi, t[i])];
  return `${t.length} points, θ ${lo}–${hi}°`;
}

/**
 * Group raw beams into one Measurement per (unit, frequency): one grid for all beams (built
 * from the directions most beams share), coincident samples merged by power average
 * (mergeSamples, Eq. 1 there; or the job file's merge_rule), every merge of every beam checked
 * for samples more than CONFLICT_DB apart ('duplicate-differs', or the unit refused with
 * merge_rule: refuse), the grid's partial-sphere / trp-partial-sphere / missing-points warnings
 * (gridWarnings), beams on another grid resampled with a 'beam-resampled' warning
 * or refused beyond MAX_RESAMPLE_DISTANCE_DEG. Problems are errors naming the file; a unit with
 * an error keeps its other beams.
 * Memory: with `consumeRaw` the raw beams' `values` arrays are consumed — merged in place where
 * the rows are θ-major (mergeSamples' in-place route) and then emptied — so a large export is
 * held once, not twice; without it the raw beams are left untouched.
 */
export function assembleMeasurements(beams: RawBeam[], sources: SourceFile[], opts: AssembleOptions = {}): AssembleResult {
  const errors: InputError[] = [];
  const warnings: Warning[] = [];
  const measurements: Measurement[] = [];
  const groups = new Map<string, RawBeam[]>();
  for (const b of beams) {
    // One measurement per unit, frequency, quantity and polarization component: a unit measured
    // both ways (EIRP and EIS exports) gives two measurements, paired later (src/batch/pairing).
    const key = `${b.unit}\u0000${b.frequencyHz ?? 'none'}\u0000${b.quantity}\u0000${b.polarization ?? ''}`;
    const list = groups.get(key);
    if (list) list.push(b);
    else groups.set(key, [b]);
  }
  // A values array passed for two beams (in any group) must survive the first merge: never merged in place.
  const shared = new Set<Float64Array>();
  const seenValues = new Set<Float64Array>();
  for (const b of beams) (seenValues.has(b.values) || !opts.consumeRaw ? shared : seenValues).add(b.values);
  for (const list of groups.values()) {
    const m = assembleOne(list, sources, errors, shared, opts.mergeRule ?? 'power-average');
    if (m) {
      measurements.push(m);
      // The components of a θ/φ pair repeat their total's warnings (same unit, files and grid): once is enough.
      const said = new Set(warnings.map((w) => `${w.code}|${w.file}|${w.line}|${w.message}`));
      warnings.push(...m.warnings.filter((w) => !said.has(`${w.code}|${w.file}|${w.line}|${w.message}`)));
    }
  }
  return { measurements, errors, warnings };
}

/**
 * Dropout cells (job file dropout_tokens) leave a beam without a sample at a direction the other
 * beams have. Such a direction is taken out of every beam of the unit (in place), so all beams
 * stay on one grid and the direction becomes a missing grid point (its solid angle is then
 * accounted by the grid's weights) instead of being interpolated. Only units with a file that had
 * dropouts are touched. Gives the directions removed ('θ …°, φ …°'). Cost O(samples).
 */
function dropoutDirections(beams: RawBeam[]): string[] {
  if (!beams.some((b) => b.hasDropouts)) return [];
  const key = (b: RawBeam, i: number): string => `${b.thetaDeg[i]}|${b.phiDeg[i]}`;
  const all = new Map<string, string>();
  for (const b of beams) for (let i = 0; i < b.values.length; i++) if (!all.has(key(b, i))) all.set(key(b, i), `θ ${b.thetaDeg[i]}°, φ ${b.phiDeg[i]}°`);
  const gone = new Set<string>();
  for (const b of beams) {
    if (!b.hasDropouts) continue;
    const own = new Set<string>();
    for (let i = 0; i < b.values.length; i++) own.add(key(b, i));
    for (const k of all.keys()) if (!own.has(k)) gone.add(k);
  }
  if (gone.size === 0) return [];
  const cache = new Map<Float64Array, Uint8Array>();
  for (const b of beams) {
    let keep = cache.get(b.thetaDeg);
    if (!keep || keep.length !== b.values.length) {
      keep = new Uint8Array(b.values.length);
      for (let i = 0; i < keep.length; i++) keep[i] = gone.has(key(b, i)) ? 0 : 1;
      cache.set(b.thetaDeg, keep);
    }
    const pick = (a: Float64Array): Float64Array => a.filter((_, i) => keep![i] === 1);
    [b.thetaDeg, b.phiDeg, b.values] = [pick(b.thetaDeg), pick(b.phiDeg), pick(b.values)];
  }
  return [...gone].map((k) => all.get(k)!);
}

const RULE_TEXT: Record<MergeRule, string> = { 'power-average': 'power average', first: 'the first sample', last: 'the last sample', refuse: 'refused' };

/**
 * Conflicting merges of one beam (samples of one direction more than CONFLICT_DB apart, at the
 * φ seam, a pole or a repeated row) as one 'duplicate-differs' warning naming each direction,
 * both samples (row of the beam, angles as written) and their values; null without conflicts.
 */
function conflictWarning(build: GridBuild, b: RawBeam, rule: MergeRule): { warning: Warning; count: number } | null {
  const c = mergeConflicts(build, b.values);
  if (c.count === 0) return null;
  const unit = b.valueUnit;
  const sample = (i: number) => `row ${i + 1} of the beam (θ ${b.thetaDeg[i]}, φ ${b.phiDeg[i]} as written) ${b.values[i]} ${unit}`;
  const list = c.worst.map((x) => `θ ${build.grid.thetaDeg[x.point]}°, φ ${build.grid.phiDeg[x.point]}°: ${sample(x.low)} vs ${sample(x.high)} (${(x.highDb - x.lowDb).toFixed(2)} dB apart)`).join('; ');
  const more = c.count > c.worst.length ? `; … (${c.count - c.worst.length} more)` : '';
  const what = rule === 'refuse' ? 'the unit is refused (merge_rule: refuse)' : `merged by ${RULE_TEXT[rule]}`;
  return {
    warning: warning('duplicate-differs', `beam '${b.beam}': ${c.count} direction${c.count === 1 ? '' : 's'} hold${c.count === 1 ? 's' : ''} samples more than ${CONFLICT_DB} dB apart, ${what}: ${list}${more}`, { file: b.file, line: b.firstLine }),
    count: c.count,
  };
}

function assembleOne(list: RawBeam[], sources: SourceFile[], errors: InputError[], shared: Set<Float64Array>, rule: MergeRule): Measurement | null {
  const ref = list[0];
  const freqText = ref.frequencyHz === null ? 'no frequency' : `${ref.frequencyHz / 1e9} GHz`;
  const what = `unit '${ref.unit}' (${freqText})`;
  const warnings: Warning[] = [];
  const seen = new Map<string, RawBeam>();
  const kept: RawBeam[] = [];
  for (const b of list) {
    const line = b.firstLine ?? 1;
    if (b.quantity !== ref.quantity || b.valueUnit !== ref.valueUnit) {
      errors.push(inputError(b.file, line, 1, 'quantity', `${b.quantity} (${b.valueUnit})`,
        `${ref.quantity} (${ref.valueUnit}) like the other beams of ${what} in ${ref.file}`));
      continue;
    }
    const dup = seen.get(b.beam);
    if (dup) {
      errors.push(inputError(b.file, line, 1, 'beam', b.beam, `each beam of ${what} once (beam '${b.beam}' is also in ${dup.file}:${dup.firstLine ?? 1})`));
      continue;
    }
    seen.set(b.beam, b);
    kept.push(b);
  }
  if (kept.length === 0) return null;
  const dropped = dropoutDirections(kept);
  if (dropped.length > 0) {
    warnings.push(warning('dropout-samples', `${what}: ${dropped.length} direction${dropped.length === 1 ? '' : 's'} without a sample in some beam (dropout cells) left out of every beam, so ${dropped.length === 1 ? 'it is a missing grid point' : 'they are missing grid points'}: ${dropped.slice(0, 5).join('; ')}${dropped.length > 5 ? '; …' : ''}`, { file: ref.file }));
  }

  const sets: AngleSet[] = [];
  for (const b of kept) {
    const s = sets.find((x) => sameAngles(x, b));
    if (s) s.beams.push(b);
    else sets.push({ thetaDeg: b.thetaDeg, phiDeg: b.phiDeg, beams: [b] });
  }
  const main = sets.reduce((best, s) => (s.beams.length > best.beams.length ? s : best), sets[0]);
  let build: GridBuild;
  try {
    build = buildSphereGrid(main.thetaDeg, main.phiDeg);
  } catch (e) {
    const b = main.beams[0];
    errors.push(inputError(b.file, b.firstLine ?? 1, 1, 'grid', (e as Error).message.replace(/^buildSphereGrid: /, ''), 'at least 4 distinct directions on the sphere', true));
    return null;
  }
  warnings.push(...gridWarnings(build.grid, ref.quantity, { file: main.beams[0].file }));
  const patterns = new Map<RawBeam, BeamPattern>();
  const pairs = literalDuplicatePairs(build, main);
  let refused = false;
  for (const b of main.beams) {
    const d = literalDuplicates(pairs, b);
    const conflict = conflictWarning(build, b, rule);
    if (conflict) {
      warnings.push(conflict.warning);
      if (rule === 'refuse') {
        refused = true;
        errors.push(inputError(b.file, b.firstLine ?? 1, 1, 'merge', `beam '${b.beam}' with ${conflict.count} direction${conflict.count === 1 ? '' : 's'} whose samples differ by more than ${CONFLICT_DB} dB (${conflict.warning.message.replace(/^beam '[^']*': /, '')})`,
          `coincident samples within ${CONFLICT_DB} dB (merge_rule: refuse in the job file), or another merge_rule`, true));
      }
    }
    patterns.set(b, { id: b.beam, values: mergeConsuming(build, b, shared, rule) });
    if (d.count > 0 && !conflict) {
      const diff = d.maxDiffDb > 0 ? ` with values up to ${d.maxDiffDb.toFixed(2)} dB apart (at ${d.at}; within ${CONFLICT_DB} dB)` : ' with equal values';
      warnings.push(warning('duplicate-merged', `beam '${b.beam}': ${d.count} row${d.count === 1 ? '' : 's'} repeat${d.count === 1 ? 's' : ''} a direction${diff}; merged by ${RULE_TEXT[rule]}`, { file: b.file, line: b.firstLine }));
    }
  }
  for (const s of sets) {
    if (s === main) continue;
    let own: GridBuild;
    try {
      own = buildSphereGrid(s.thetaDeg, s.phiDeg);
    } catch (e) {
      for (const b of s.beams) errors.push(inputError(b.file, b.firstLine ?? 1, 1, 'grid', (e as Error).message.replace(/^buildSphereGrid: /, ''), 'at least 4 distinct directions on the sphere', true));
      continue;
    }
    const same = sameGrid(own, build);
    for (const b of s.beams) {
      const conflict = conflictWarning(own, b, rule);
      if (conflict) {
        warnings.push(conflict.warning);
        if (rule === 'refuse') {
          refused = true;
          errors.push(inputError(b.file, b.firstLine ?? 1, 1, 'merge', `beam '${b.beam}' with ${conflict.count} direction${conflict.count === 1 ? '' : 's'} whose samples differ by more than ${CONFLICT_DB} dB`,
            `coincident samples within ${CONFLICT_DB} dB (merge_rule: refuse in the job file), or another merge_rule`, true));
        }
      }
      const merged = mergeConsuming(own, b, shared, rule);
      if (same) {
        patterns.set(b, { id: b.beam, values: merged });
        continue;
      }
      const r = resampleBeam(own.grid, merged, build.grid);
      if (!(r.maxDistanceDeg <= MAX_RESAMPLE_DISTANCE_DEG)) {
        errors.push(inputError(b.file, b.firstLine ?? 1, 1, 'grid', `beam '${b.beam}' on its own grid (${gridText(own)}), ${r.maxDistanceDeg.toFixed(1)}° from the unit grid`,
          `the grid of the other beams of ${what} (${gridText(build)}), or one within ${MAX_RESAMPLE_DISTANCE_DEG}° to resample from`, true));
        continue;
      }
      patterns.set(b, { id: b.beam, values: r.values });
      warnings.push(warning('beam-resampled', `beam '${b.beam}' measured on another grid (${gridText(own)}) resampled (${r.method}, up to ${r.maxDistanceDeg.toFixed(2)}° from data) onto the unit grid (${gridText(build)})`, { file: b.file, line: b.firstLine }));
    }
  }
  if (refused) return null;
  const beamsOut = kept.filter((b) => patterns.has(b)).map((b) => patterns.get(b)!).sort((x, y) => compareBeamIds(x.id, y.id));
  if (ref.frequencyHz === null) warnings.push(warning('frequency-missing', `${what}: no frequency found`, { file: ref.file }));
  const files = new Set(kept.map((b) => b.file));
  const metadata: Record<string, string> = {};
  for (const b of kept) for (const [k, v] of Object.entries(b.metadata ?? {})) metadata[k] ??= v;
  try {
    return createMeasurement({
      unit: ref.unit, frequencyHz: ref.frequencyHz, quantity: ref.quantity, valueUnit: ref.valueUnit, grid: build.grid, beams: beamsOut,
      sources: sources.filter((s) => files.has(s.path)), warnings, metadata, mergedSamples: build.merged,
      ...(ref.polarization ? { polarization: ref.polarization } : {}),
    });
  } catch (e) {
    errors.push({ file: ref.file, message: `${ref.file}: ${what} could not be assembled (${(e as Error).message}), expected a consistent set of beams` });
    return null;
  }
}
