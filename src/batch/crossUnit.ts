/**
 * Analysis across the unit results of one run (main thread, after every unit is back): deltas
 * against a reference unit, and the trend over frequency of a unit measured at several
 * frequencies. Mutates the results in place; the input order is kept.
 */
import type { UnitResult } from '../types.js';
import { metricsOfUnit } from '../metrics/catalogue.js';
import { referenceDeltas } from '../analysis/referenceDeltas.js';
import { frequencyTrend } from '../analysis/frequencyTrend.js';
import { pointingDrift } from '../analysis/pointingDrift.js';

/** A beam whose peak direction moves more than this across the measured band is flagged (our default). */
export const MAX_POINTING_DRIFT_DEG = 5;

/**
 * reference: every unit gets `reference = { unit, deltas }` against the reference unit at the
 * same frequency (null when the reference has no measurement there, or for the reference
 * itself). frequencyTrend and pointingDrift: set on every unit result of a unit with two or more
 * frequencies. Idempotent: the unit tasks run it on their own units before rendering PDFs, and
 * the main thread runs it again over the whole build.
 * With `external`, the reference came from its own folder and the unit tasks already set the
 * deltas; they are kept.
 * @returns a plain-words problem when the reference unit is not among the results, else null.
 */
export function crossUnitExtras(units: UnitResult[], reference: string | undefined, external = false): string | null {
  let problem: string | null = null;
  // An external reference (its own folder) is not among the results: the unit tasks set its deltas.
  if (reference !== undefined && !external) {
    const refs = units.filter((u) => u.unit === reference);
    if (refs.length === 0) problem = `--reference: unit '${reference}' is not among the analyzed units`;
    for (const u of units) {
      const ref = refs.find((r) => r.frequencyHz === u.frequencyHz && r.quantity === u.quantity);
      u.reference = ref && ref !== u ? { unit: reference, deltas: referenceDeltas(metricsOfUnit(u), metricsOfUnit(ref)) } : null;
    }
  }
  const byUnit = new Map<string, UnitResult[]>();
  // Per unit and quantity: a unit measured both ways has a transmit and a receive trend.
  for (const u of units) byUnit.set(`${u.unit}\u0000${u.quantity}`, [...(byUnit.get(`${u.unit}\u0000${u.quantity}`) ?? []), u]);
  for (const list of byUnit.values()) {
    const withF = list.filter((u): u is UnitResult & { frequencyHz: number } => u.frequencyHz !== null);
    if (withF.length < 2) continue;
    const trend = frequencyTrend(withF.map((u) => ({ frequencyHz: u.frequencyHz, metrics: metricsOfUnit(u) })));
    const drift = pointingDrift(withF.map((u) => ({ frequencyHz: u.frequencyHz, beams: u.beams })), MAX_POINTING_DRIFT_DEG)
      .map(({ beam, driftDeg, flagged, betweenHz }) => ({ beam, driftDeg, flagged, betweenHz }));
    for (const u of list) {
      u.frequencyTrend = trend as UnitResult['frequencyTrend'];
      u.pointingDrift = drift;
    }
  }
  return problem;
}
