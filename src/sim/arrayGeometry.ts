import type { ArrayElement, Vec3 } from './types.js';

/**
 * Elements of a rectangular sub-array of rows × cols on one face of a body: centred on
 * centerM, in the plane normal to `normal`, columns stepped along axisU and rows along
 * axisV = normal × axisU, spacing spacingM both ways.
 * Formula: rₘₙ = c + (n − (cols−1)/2)·d·û + (m − (rows−1)/2)·d·v̂, v̂ = n̂ × û.
 * Units: metres. Boundary rule: axisU is used as given; pass a unit vector orthogonal to the
 * normal (the function does not re-orthogonalize).
 * Cost: O(rows · cols).
 * @throws Error when rows or cols is not a positive integer.
 * @example
 * planarSubArray({ rows: 1, cols: 4, spacingM: 5.35e-3, centerM: [0, 0, 0], normal: [1, 0, 0], axisU: [0, 0, 1] });
 */
export function planarSubArray(opts: {
  rows: number;
  cols: number;
  spacingM: number;
  centerM: Vec3;
  normal: Vec3;
  axisU: Vec3;
  q?: number;
  floorDb?: number;
  polarizationDeg?: number;
}): ArrayElement[] {
  const { rows, cols, spacingM: d, centerM: c, normal: nv, axisU: u } = opts;
  if (!Number.isInteger(rows) || !Number.isInteger(cols) || rows < 1 || cols < 1) {
    throw new Error(`planarSubArray: rows and cols must be positive integers, got ${rows} × ${cols}`);
  }
  const v: Vec3 = [nv[1] * u[2] - nv[2] * u[1], nv[2] * u[0] - nv[0] * u[2], nv[0] * u[1] - nv[1] * u[0]];
  const out: ArrayElement[] = [];
  for (let m = 0; m < rows; m++) {
    for (let n = 0; n < cols; n++) {
      const a = (n - (cols - 1) / 2) * d;
      const b = (m - (rows - 1) / 2) * d;
      out.push({
        positionM: [c[0] + a * u[0] + b * v[0], c[1] + a * u[1] + b * v[1], c[2] + a * u[2] + b * v[2]],
        boresight: nv,
        q: opts.q ?? 1.5,
        floorDb: opts.floorDb ?? -20,
        polarizationDeg: opts.polarizationDeg ?? 0,
        amplitudeErrorDb: 0,
        phaseErrorDeg: 0,
        failed: false,
      });
    }
  }
  return out;
}
