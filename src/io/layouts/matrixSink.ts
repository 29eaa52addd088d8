import { levelToDb } from './levelToDb.js';
import type { MatrixPlan } from './layoutTypes.js';
import { ErrorList, inputError } from '../inputError.js';
import type { RowLocator, RowSink } from '../rowSink.js';
import { SampleAccumulator } from '../sampleAccumulator.js';
import type { DropoutLog } from './dropoutLog.js';

const RAD_TO_DEG = 180 / Math.PI;

/**
 * Matrix-layout rows → one sample group: row angle (θ or el) in field 0, one value per column
 * angle (φ or az). az/el → θ = 90° − el, φ = az (CONTRACT.md "Matrix layout").
 */
export class MatrixSink implements RowSink {
  rows = 0;
  readonly acc: SampleAccumulator;
  /** Column angles in degrees as written (φ or az). */
  readonly colDeg: Float64Array;

  constructor(
    private readonly plan: MatrixPlan,
    private readonly file: string,
    private readonly errors: ErrorList,
    firstLine: number,
    private readonly dropouts: DropoutLog,
  ) {
    this.acc = new SampleAccumulator(null, firstLine);
    const f = plan.angleUnit === 'rad' ? RAD_TO_DEG : 1;
    this.colDeg = Float64Array.from(plan.colAnglesRaw, (a) => a * f);
  }

  row(line: number, nums: Float64Array, _keys: Int32Array, loc: RowLocator): void {
    const p = this.plan;
    const rad = p.angleUnit === 'rad';
    const a = rad ? nums[0] * RAD_TO_DEG : nums[0];
    const tp = p.angleConvention === 'theta-phi';
    const [lo, hi] = tp ? [0, 180] : [-90, 90];
    const slack = rad ? 1e-9 : 0;
    if (!(a >= lo - slack && a <= hi + slack)) {
      this.errors.add(inputError(this.file, line, loc.col(0), p.fields.names[0], loc.text(0).trim(),
        `${tp ? 'theta' : 'elevation'} between ${lo} and ${hi} degrees`));
      return;
    }
    const clamped = Math.min(hi, Math.max(lo, a));
    const thetaDeg = tp ? clamped : 90 - clamped;
    const u = p.fileValueUnit;
    for (let c = 1; c < nums.length && c <= this.colDeg.length; c++) {
      const v = nums[c];
      if (v !== v) {
        this.dropouts.add(line, p.fields.names[c], thetaDeg, this.colDeg[c - 1]);
        continue; // a dropout: no sample at this direction
      }
      const db = levelToDb(v, u);
      if (typeof db === 'string') {
        this.errors.add(inputError(this.file, line, loc.col(c), p.fields.names[c], loc.text(c).trim(), db));
        continue;
      }
      this.acc.push(thetaDeg, this.colDeg[c - 1], db);
    }
    this.rows++;
  }
}
