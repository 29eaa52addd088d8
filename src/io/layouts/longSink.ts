import { levelToDb } from './levelToDb.js';
import { pairComponent } from '../columnRoles.js';
import type { LongPlan } from './layoutTypes.js';
import type { DropoutLog } from './dropoutLog.js';
import { RowAngles } from './rowAngles.js';
import { ErrorList, inputError } from '../inputError.js';
import type { KeyTable } from '../keyTable.js';
import type { RowLocator, RowSink } from '../rowSink.js';
import { SampleAccumulator } from '../sampleAccumulator.js';


interface Group {
  unitId: number;
  beamId: number;
  polId: number;
  freqRaw: number;
  acc: SampleAccumulator;
  /** The φ component of a θ/φ value pair (acc then holds the θ component). */
  accPhi: SampleAccumulator | null;
}

/** A finished group before identity and polarization are resolved. */
export interface LongGroup {
  unitId: number;
  beamId: number;
  polId: number;
  /** Frequency as written in the column, or NaN without a column. */
  freqRaw: number;
  firstLine: number;
  thetaDeg: Float64Array;
  phiDeg: Float64Array;
  /** The value, or the θ component when the file has a θ/φ value pair. */
  values: Float64Array;
  /** The φ component of a θ/φ value pair (same directions as values). */
  valuesPhi?: Float64Array;
}

/**
 * Long-layout rows → per (unit, beam, pol, frequency) sample groups. Checks angle ranges,
 * converts az/el, radians and linear power (mW, W → dBm) and keeps both components of a θ/φ
 * value pair (the reader decides how they combine: src/io/polarizationBeams.ts).
 */
export class LongSink implements RowSink {
  rows = 0;
  private groups: Group[] = [];
  private byKey = new Map<string, Group>();
  private last: Group | null = null;
  private polOk: number[] = [];
  // Per-file constants of row(), fixed once instead of derived on every row.
  private readonly angles: RowAngles;

  constructor(
    protected readonly plan: LongPlan,
    private readonly file: string,
    private readonly errors: ErrorList,
    private readonly keys: KeyTable,
    private readonly dropouts: DropoutLog,
  ) {
    this.angles = new RowAngles(plan.angleConvention, plan.angleUnit);
  }

  private err(line: number, f: number, loc: RowLocator, expected: string): void {
    this.errors.add(inputError(this.file, line, loc.col(f), this.plan.fields.names[f], loc.text(f).trim(), expected));
  }

  private fieldOfNum(slot: number): number {
    return this.plan.fields.slots.findIndex((s, i) => s === slot && this.plan.fields.kinds[i] === 1);
  }

  private fieldOfKey(slot: number): number {
    return this.plan.fields.slots.findIndex((s, i) => s === slot && this.plan.fields.kinds[i] === 2);
  }

  private toDb(v: number, slot: number, line: number, loc: RowLocator): number | null {
    const db = levelToDb(v, this.plan.fileValueUnit);
    if (typeof db === 'number') return db;
    this.err(line, this.fieldOfNum(slot), loc, db);
    return null;
  }

  row(line: number, nums: Float64Array, keys: Int32Array, loc: RowLocator): void {
    const p = this.plan;
    const angles = this.angles;
    const bad = angles.read(nums[0], nums[1]);
    if (bad !== 0) {
      this.err(line, this.fieldOfNum(bad - 1), loc, angles.expected(bad));
      return;
    }
    const thetaDeg = angles.thetaDeg;
    const phiDeg = angles.phiDeg;

    if (nums[2] !== nums[2] || (p.pairValues && nums[3] !== nums[3])) {
      this.dropouts.add(line, p.fields.names[this.fieldOfNum(nums[2] !== nums[2] ? 2 : 3)], thetaDeg, phiDeg);
      this.rows++;
      return; // a dropout: no sample at this direction for this beam
    }
    const value = this.toDb(nums[2], 2, line, loc);
    if (value === null) return;
    let phiValue = NaN;
    if (p.pairValues) {
      const b = this.toDb(nums[3], 3, line, loc);
      if (b === null) return;
      phiValue = b;
    }
    let freqRaw = NaN;
    if (p.freqSlot >= 0) {
      freqRaw = nums[p.freqSlot];
      if (!(freqRaw > 0)) {
        this.err(line, this.fieldOfNum(p.freqSlot), loc, 'a positive frequency');
        return;
      }
    }
    const unitId = p.unitKey >= 0 ? keys[p.unitKey] : -1;
    const beamId = p.beamKey >= 0 ? keys[p.beamKey] : -1;
    let polId = -1;
    if (p.polKey >= 0) {
      polId = keys[p.polKey];
      if (this.polKind(polId) < 0) {
        this.err(line, this.fieldOfKey(p.polKey), loc, "'theta' or 'phi' (or another pair: co/cross, H/V, LHCP/RHCP)");
        return;
      }
    }
    let g = this.last;
    if (g === null || g.unitId !== unitId || g.beamId !== beamId || g.polId !== polId || !(g.freqRaw === freqRaw || (freqRaw !== freqRaw && g.freqRaw !== g.freqRaw))) {
      g = this.group(unitId, beamId, polId, freqRaw, line);
      this.last = g;
    }
    g.acc.push(thetaDeg, phiDeg, value);
    if (g.accPhi) g.accPhi.push(thetaDeg, phiDeg, phiValue);
    this.rows++;
  }

  /** 0 = theta, 1 = phi, −1 = not a polarization name. */
  polKind(polId: number): number {
    let k = this.polOk[polId];
    if (k === undefined) {
      k = pairComponent(this.keys.names[this.plan.polKey][polId]);
      this.polOk[polId] = k;
    }
    return k;
  }

  private group(unitId: number, beamId: number, polId: number, freqRaw: number, line: number): Group {
    const key = `${unitId}|${beamId}|${polId}|${freqRaw}`;
    let g = this.byKey.get(key);
    if (!g) {
      const template = this.groups.length ? this.groups[0].acc : null;
      const acc = new SampleAccumulator(template, line);
      // The φ component follows the θ component's directions (the first group's, or its own group's).
      const accPhi = this.plan.pairValues ? new SampleAccumulator(template ?? acc, line) : null;
      g = { unitId, beamId, polId, freqRaw, acc, accPhi };
      this.groups.push(g);
      this.byKey.set(key, g);
    }
    return g;
  }

  /** The groups in order of first appearance. */
  finish(): LongGroup[] {
    return this.groups.map((g) => ({
      unitId: g.unitId,
      beamId: g.beamId,
      polId: g.polId,
      freqRaw: g.freqRaw,
      firstLine: g.acc.firstLine,
      ...g.acc.finish(),
      ...(g.accPhi ? { valuesPhi: g.accPhi.finish().values } : {}),
    }));
  }
}
