/**
 * Growable (θ, φ, value) columns of one beam group, doubling Float64Arrays.
 *
 * Memory rule: a group whose directions repeat those of the first group (the template) stores
 * only its values, so a 64-beam file keeps one copy of the angles; equal-length followers get
 * the very same angle arrays, which assembleMeasurements recognizes by reference.
 */
export class SampleAccumulator {
  n = 0;
  values: Float64Array;
  thetaDeg: Float64Array | null = null;
  phiDeg: Float64Array | null = null;
  private views = new Map<number, [Float64Array, Float64Array]>();

  /**
   * @param shared keep the values in shared memory (SharedArrayBuffer), so another thread (the
   *   insight lane, src/batch/insightLane.ts) reads the unit's beams without a copy; the angles stay
   *   ordinary (one copy per file, sent with the grid).
   */
  constructor(
    readonly template: SampleAccumulator | null,
    readonly firstLine: number,
    state?: AccumulatorState,
    readonly shared = false,
  ) {
    if (state !== undefined) {
      // Continued from another thread's accumulator (readInParallel.ts): its arrays as they are.
      this.n = state.n;
      this.values = state.values;
      this.thetaDeg = state.thetaDeg;
      this.phiDeg = state.phiDeg;
      return;
    }
    // A follower usually has the template's length: start there, so it neither grows nor
    // keeps slack (growth would leave garbage and up to 2× capacity per beam).
    this.values = floats(template === null ? 1024 : Math.max(1024, template.n), shared);
    if (template === null) {
      this.thetaDeg = new Float64Array(1024);
      this.phiDeg = new Float64Array(1024);
    }
  }

  /**
   * The arrays as they stand (capacity included; own angles null while following the template),
   * for handing this accumulator to another thread.
   */
  state(): AccumulatorState {
    return { n: this.n, values: this.values, thetaDeg: this.thetaDeg, phiDeg: this.phiDeg };
  }

  push(thetaDeg: number, phiDeg: number, value: number): void {
    const n = this.n;
    if (n === this.values.length) this.grow();
    if (this.thetaDeg === null) {
      const t = this.template as SampleAccumulator;
      if (n >= t.n || t.thetaDeg![n] !== thetaDeg || t.phiDeg![n] !== phiDeg) this.materialize();
    }
    if (this.thetaDeg !== null) {
      this.thetaDeg[n] = thetaDeg;
      this.phiDeg![n] = phiDeg;
    }
    this.values[n] = value;
    this.n = n + 1;
  }

  /**
   * push() of `rows` rows laid out from src[at] on, `stride` numbers a row: θ, φ, the value
   * (θ normalized with + 0, as the per-row path does). The same arrays, and the same switch from
   * the template's angles to own angles at the first sample that leaves them.
   */
  pushRows(src: Float64Array, at: number, stride: number, rows: number): void {
    let n = this.n;
    while (n + rows > this.values.length) this.grow();
    const values = this.values;
    let r = 0;
    let o = at;
    if (this.thetaDeg === null) {
      const t = this.template as SampleAccumulator;
      const tt = t.thetaDeg as Float64Array;
      const tp = t.phiDeg as Float64Array;
      const tn = t.n;
      for (; r < rows; r++, o += stride) {
        if (n >= tn || tt[n] !== src[o] + 0 || tp[n] !== src[o + 1]) break;
        values[n++] = src[o + 2];
      }
      this.n = n;
      if (r === rows) return;
      this.materialize();
    }
    const th = this.thetaDeg as Float64Array;
    const ph = this.phiDeg as Float64Array;
    for (; r < rows; r++, o += stride) {
      th[n] = src[o] + 0;
      ph[n] = src[o + 1];
      values[n++] = src[o + 2];
    }
    this.n = n;
  }

  private grow(): void {
    const cap = this.values.length * 2;
    const g = (a: Float64Array, shared = false): Float64Array => {
      const b = floats(cap, shared);
      b.set(a);
      return b;
    };
    this.values = g(this.values, this.shared);
    if (this.thetaDeg) {
      this.thetaDeg = g(this.thetaDeg);
      this.phiDeg = g(this.phiDeg!);
    }
  }

  private materialize(): void {
    const t = this.template as SampleAccumulator;
    this.thetaDeg = new Float64Array(this.values.length);
    this.phiDeg = new Float64Array(this.values.length);
    this.thetaDeg.set(t.thetaDeg!.subarray(0, this.n));
    this.phiDeg.set(t.phiDeg!.subarray(0, this.n));
  }

  /** Angle arrays of the first `n` samples, one shared object per length. */
  private angleView(n: number): [Float64Array, Float64Array] {
    let v = this.views.get(n);
    if (!v) {
      v = [trim(this.thetaDeg!, n), trim(this.phiDeg!, n)];
      this.views.set(n, v);
    }
    return v;
  }

  /** Final arrays (trimmed; shared angles for template followers). */
  finish(): { thetaDeg: Float64Array; phiDeg: Float64Array; values: Float64Array } {
    const values = trim(this.values, this.n, this.shared);
    if (this.thetaDeg === null) {
      const [thetaDeg, phiDeg] = (this.template as SampleAccumulator).angleView(this.n);
      return { thetaDeg, phiDeg, values };
    }
    if (this.template === null) {
      const [thetaDeg, phiDeg] = this.angleView(this.n);
      return { thetaDeg, phiDeg, values };
    }
    return { thetaDeg: trim(this.thetaDeg, this.n), phiDeg: trim(this.phiDeg!, this.n), values };
  }
}

/** An accumulator's arrays (see SampleAccumulator.state). */
export interface AccumulatorState {
  n: number;
  values: Float64Array;
  thetaDeg: Float64Array | null;
  phiDeg: Float64Array | null;
}

/** View when little capacity is wasted, else a compact copy (in shared memory when `shared`). */
function trim(a: Float64Array, n: number, shared = false): Float64Array {
  if (a.length <= n * 1.25) return a.subarray(0, n);
  if (!shared) return a.slice(0, n);
  const b = floats(n, shared);
  b.set(a.subarray(0, n));
  return b;
}

/** A zeroed Float64Array of n elements, in shared memory when `shared`. */
function floats(n: number, shared: boolean): Float64Array {
  return shared ? new Float64Array(new SharedArrayBuffer(n * Float64Array.BYTES_PER_ELEMENT)) : new Float64Array(n);
}
