const RAD_TO_DEG = 180 / Math.PI;
/** Slack for angles converted from radians (rounding of the written value). */
const ANGLE_SLACK_DEG = 1e-9;

/**
 * The two angle cells of a row → θ/φ in degrees (CONTRACT.md "Angles"): radians converted,
 * θ in [0, 180] (or el in [−90, 90], θ = 90° − el), φ or az in [−180, 360] (normalized to
 * [0, 360) later by the grid builder). Per-file constants fixed once; O(1) a row.
 */
export class RowAngles {
  thetaDeg = 0;
  phiDeg = 0;
  private readonly rad: boolean;
  private readonly slack: number;
  private readonly thetaPhi: boolean;
  private readonly lo1: number;
  private readonly hi1: number;

  constructor(convention: 'theta-phi' | 'az-el', unit: 'deg' | 'rad') {
    this.rad = unit === 'rad';
    this.slack = this.rad ? ANGLE_SLACK_DEG : 0;
    this.thetaPhi = convention === 'theta-phi';
    this.lo1 = this.thetaPhi ? 0 : -90;
    this.hi1 = this.thetaPhi ? 180 : 90;
  }

  /**
   * The angle cells that read() passes through unchanged (θ/φ in degrees, both in range), as
   * [θ lo, θ hi, φ lo, φ hi]; null for az/el or radians (always converted). For a per-row fast
   * path that must agree with read().
   */
  unchangedRange(): [number, number, number, number] | null {
    return this.thetaPhi && !this.rad ? [this.lo1, this.hi1, -180, 360] : null;
  }

  /** Read (θ, φ) or (el, az) as written: 0 when both are in range, else 1 or 2 (the angle out of range). */
  read(first: number, second: number): 0 | 1 | 2 {
    let a1 = first;
    let a2 = second;
    if (this.rad) {
      a1 *= RAD_TO_DEG;
      a2 *= RAD_TO_DEG;
    }
    if (!(a1 >= this.lo1 - this.slack && a1 <= this.hi1 + this.slack)) return 1;
    if (!(a2 >= -180 - this.slack && a2 <= 360 + this.slack)) return 2;
    a1 = Math.min(this.hi1, Math.max(this.lo1, a1));
    // az/el → θ/φ: θ = 90° − el, φ = az, CONTRACT.md "Angles".
    this.thetaDeg = this.thetaPhi ? a1 : 90 - a1;
    this.phiDeg = a2;
    return 0;
  }

  /** "expected" text for angle 1 or 2 out of range. */
  expected(which: 1 | 2): string {
    const unit = this.rad ? 'degrees (as radians)' : 'degrees';
    if (which === 1) return `${this.thetaPhi ? 'theta' : 'elevation'} between ${this.lo1} and ${this.hi1} ${unit}`;
    return `${this.thetaPhi ? 'phi' : 'azimuth'} between -180 and 360 ${unit}`;
  }
}
