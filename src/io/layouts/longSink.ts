import { levelToDb, unchangedLevels } from './levelToDb.js';
import { pairComponent } from '../columnRoles.js';
import type { LongPlan } from './layoutTypes.js';
import type { DropoutLog } from './dropoutLog.js';
import { RowAngles } from './rowAngles.js';
import { ErrorList, inputError } from '../inputError.js';
import type { KeyTable } from '../keyTable.js';
import type { RowBlock, RowLocator, RowSink } from '../rowSink.js';
import { SampleAccumulator, type AccumulatorState } from '../sampleAccumulator.js';


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
 * One group read by another thread over the second part of a file (readInParallel.ts): its key
 * as text (null where the file has no such column), and its samples. Lines count from that
 * thread's first line.
 */
export interface LongPart {
  unit: string | null;
  beam: string | null;
  pol: string | null;
  freqRaw: number;
  firstLine: number;
  acc: AccumulatorState;
}

/** What a thread that read the second part of a file hands back (see LongSink.parts). */
export interface LongParts {
  groups: LongPart[];
  /** Data rows it accepted. */
  rows: number;
  /** Its copy of the file's first group's directions, which its groups followed. */
  templateN: number;
  templateTheta: Float64Array;
  templatePhi: Float64Array;
}

/** A group's key in byKey: its unit, beam and pol ids (−1 without the column) and its frequency as written. */
function groupKey(unitId: number, beamId: number, polId: number, freqRaw: number): string {
  return `${unitId}|${beamId}|${polId}|${freqRaw}`;
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
  /** The directions new groups follow (the first group's), when another sink read them. */
  private template: SampleAccumulator | null = null;
  /** The first group got rows again after another group had started. */
  private firstReopened = false;
  // Per-file constants of row(), fixed once instead of derived on every row.
  private readonly angles: RowAngles;

  // The plain row (θ/φ in degrees, one dB value, no frequency or pol column) continuing the
  // last group, checked against the owners' pass-through ranges (RowAngles, levelToDb): the
  // common row of a large export takes a few comparisons and one push. NaN bounds: never plain.
  private readonly thLo: number = NaN;
  private readonly thHi: number = NaN;
  private readonly phLo: number = NaN;
  private readonly phHi: number = NaN;
  private readonly vLo: number = NaN;
  private readonly vHi: number = NaN;

  constructor(
    protected readonly plan: LongPlan,
    private readonly file: string,
    private readonly errors: ErrorList,
    private readonly keys: KeyTable,
    private readonly dropouts: DropoutLog,
    /** Values in shared memory (SampleAccumulator `shared`): another thread reads them without a copy. */
    private readonly sharedValues = false,
  ) {
    this.angles = new RowAngles(plan.angleConvention, plan.angleUnit);
    const a = this.angles.unchangedRange();
    const v = unchangedLevels(plan.fileValueUnit);
    if (a !== null && v !== null && !plan.pairValues && plan.freqSlot < 0 && plan.polKey < 0) {
      [this.thLo, this.thHi, this.phLo, this.phHi] = a;
      this.vLo = v.lo;
      this.vHi = v.hi;
    }
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
    const th = nums[0];
    const ph = nums[1];
    const v = nums[2];
    const g0 = this.last;
    if (g0 !== null && this.continuing(g0, nums, 0, 0, keys, 0, 0, 1) === 1) {
      g0.acc.push(th + 0, ph, v); // + 0: θ = −0 is +0, as RowAngles' clamp gives
      this.rows++;
      return;
    }
    this.anyRow(line, nums, keys, loc);
  }

  /**
   * How many rows, from the one with θ, φ, value at nums[o…o+2] and its keys from keys[q] on
   * (`ns` numbers and `ks` keys a row, at most `rows`), are plain (inside the pass-through ranges)
   * and continue group `g` (same unit and beam): each of them only needs a push. The one rule for
   * row() (one row) and rowBlock(); the ranges and keys are read once, outside the loop.
   */
  private continuing(g: Group, nums: Float64Array, o: number, ns: number, keys: Int32Array, q: number, ks: number, rows: number): number {
    const thLo = this.thLo, thHi = this.thHi, phLo = this.phLo, phHi = this.phHi, vLo = this.vLo, vHi = this.vHi;
    const uk = this.plan.unitKey, bk = this.plan.beamKey;
    const unitId = g.unitId, beamId = g.beamId;
    let r = 0;
    for (; r < rows; r++, o += ns, q += ks) {
      const th = nums[o];
      const ph = nums[o + 1];
      const v = nums[o + 2];
      if (!(th >= thLo && th <= thHi && ph >= phLo && ph <= phHi && v >= vLo && v <= vHi)) break;
      if (unitId !== (uk >= 0 ? keys[q + uk] : -1) || beamId !== (bk >= 0 ? keys[q + bk] : -1)) break;
    }
    return r;
  }

  /** Scratch row for the rows of a block that take the general path (anyRow). */
  private rowNums = new Float64Array(0);
  private rowKeys = new Int32Array(0);

  /**
   * A block of rows, with row()'s effect on each: runs of plain rows continuing the last group
   * (continuing(), as in row()) go to its accumulator in one call, any other row to anyRow.
   */
  rowBlock(b: RowBlock): void {
    const nums = b.nums;
    const keys = b.keys;
    const ns = b.numStride;
    const ks = b.keyStride;
    const count = b.count;
    let r = 0;
    while (r < count) {
      const g0 = this.last;
      if (g0 !== null) {
        const e = r + this.continuing(g0, nums, b.numsAt + r * ns, ns, keys, b.keysAt + r * ks, ks, count - r);
        if (e > r) {
          g0.acc.pushRows(nums, b.numsAt + r * ns, ns, e - r);
          this.rows += e - r;
          r = e;
          continue;
        }
      }
      if (this.rowNums.length !== ns) this.rowNums = new Float64Array(ns);
      if (this.rowKeys.length !== ks) this.rowKeys = new Int32Array(ks);
      b.copyRow(r, this.rowNums, this.rowKeys);
      this.anyRow(b.line + r, this.rowNums, this.rowKeys, b.locate(r));
      r++;
    }
  }

  private anyRow(line: number, nums: Float64Array, keys: Int32Array, loc: RowLocator): void {
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
    const key = groupKey(unitId, beamId, polId, freqRaw);
    let g = this.byKey.get(key);
    if (g === this.groups[0] && this.groups.length > 1) this.firstReopened = true;
    if (!g) {
      const template = this.template ?? (this.groups.length ? this.groups[0].acc : null);
      const acc = new SampleAccumulator(template, line, undefined, this.sharedValues);
      // The φ component follows the θ component's directions (the first group's, or its own group's).
      const accPhi = this.plan.pairValues ? new SampleAccumulator(template ?? acc, line, undefined, this.sharedValues) : null;
      g = { unitId, beamId, polId, freqRaw, acc, accPhi };
      this.groups.push(g);
      this.byKey.set(key, g);
    }
    return g;
  }

  /** Groups so far (the first one closes when the second starts). */
  get groupCount(): number {
    return this.groups.length;
  }

  /** The first group's samples (its directions are the template of every later group). */
  firstGroup(): SampleAccumulator | null {
    return this.groups.length ? this.groups[0].acc : null;
  }

  /** New groups follow `acc`'s directions (the first group of the file, read by another sink). */
  followTemplate(acc: SampleAccumulator): void {
    this.template = acc;
  }

  /**
   * This sink's groups for another thread (readInParallel.ts): keys as text, arrays as they are.
   * Only for a sink whose groups follow an outside template (followTemplate) and without θ/φ
   * value pairs.
   */
  parts(): LongParts {
    const t = this.template as SampleAccumulator;
    const name = (slot: number, id: number): string | null => (slot >= 0 ? this.keys.names[slot][id] : null);
    const p = this.plan;
    return {
      groups: this.groups.map((g) => ({
        unit: name(p.unitKey, g.unitId), beam: name(p.beamKey, g.beamId), pol: name(p.polKey, g.polId),
        freqRaw: g.freqRaw, firstLine: g.acc.firstLine, acc: g.acc.state(),
      })),
      rows: this.rows,
      templateN: t.n,
      templateTheta: t.thetaDeg as Float64Array,
      templatePhi: t.phiDeg as Float64Array,
    };
  }

  /**
   * Continue with the groups another thread read from the rest of the file (its lines start at
   * `lineOffset`), giving exactly the state that reading those rows here would have given: a
   * group this sink already has gets the samples pushed one by one (so a beam cut by the split
   * follows the template at its true index), a new group takes the arrays as they are (it
   * followed the same template from index 0). False, with nothing changed, when that cannot be
   * guaranteed: θ/φ value pairs, the first group reopened (here or there), or a template that
   * differs from this sink's first group.
   */
  absorb(parts: LongParts, lineOffset: number): boolean {
    const first = this.firstGroup();
    if (first === null || this.firstReopened || this.plan.pairValues || this.template !== null) return false;
    const n = parts.templateN;
    if (first.n !== n || first.thetaDeg === null || first.phiDeg === null) return false;
    for (let i = 0; i < n; i++) {
      if (first.thetaDeg[i] !== parts.templateTheta[i] || first.phiDeg[i] !== parts.templatePhi[i]) return false;
    }
    const p = this.plan;
    const idOf = (slot: number, text: string | null, add: boolean): number => {
      if (slot < 0 || text === null) return -1;
      return add ? this.keys.intern(slot, text) : this.keys.find(slot, text);
    };
    const idsOf = (q: LongPart, add: boolean): [number, number, number] | null => {
      const ids: [number, number, number] = [idOf(p.unitKey, q.unit, add), idOf(p.beamKey, q.beam, add), idOf(p.polKey, q.pol, add)];
      if (!add && ((q.unit !== null && ids[0] < 0) || (q.beam !== null && ids[1] < 0) || (q.pol !== null && ids[2] < 0))) return null;
      return ids;
    };
    for (const q of parts.groups) {
      const ids = idsOf(q, false);
      if (ids !== null && this.byKey.get(groupKey(...ids, q.freqRaw)) === this.groups[0]) return false;
      if (q.pol !== null && this.polKindOf(q.pol) < 0) return false;
    }
    for (const q of parts.groups) {
      const [unitId, beamId, polId] = idsOf(q, true) as [number, number, number];
      const key = groupKey(unitId, beamId, polId, q.freqRaw);
      const old = this.byKey.get(key);
      if (old === undefined) {
        const acc = new SampleAccumulator(first, q.firstLine + lineOffset, q.acc, this.sharedValues);
        const g: Group = { unitId, beamId, polId, freqRaw: q.freqRaw, acc, accPhi: null };
        this.groups.push(g);
        this.byKey.set(key, g);
        continue;
      }
      const { values, thetaDeg, phiDeg } = q.acc;
      const th = thetaDeg ?? parts.templateTheta;
      const ph = phiDeg ?? parts.templatePhi;
      for (let i = 0; i < q.acc.n; i++) old.acc.push(th[i], ph[i], values[i]);
    }
    this.rows += parts.rows;
    return true;
  }

  private polKindOf(text: string): number {
    return pairComponent(text);
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
