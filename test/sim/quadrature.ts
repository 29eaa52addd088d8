/**
 * Test-only quadrature for the sim's known-answer checks (kept independent of src/coverage):
 * a regular θ × φ grid (θ rows 0..180 inclusive, φ over [0, 360)) with exact cell solid
 * angles Ω = Δφ·(cos θ₁ − cos θ₂), cells spanning halfway to the neighbouring rows, pole rows
 * as caps shared by their φ columns (DESIGN.md "Regular grid weights").
 */
export function fineGrid(thetaStepDeg: number, phiStepDeg: number): {
  thetaDeg: Float64Array;
  phiDeg: Float64Array;
  weightSr: Float64Array;
} {
  const nT = Math.round(180 / thetaStepDeg) + 1;
  const nP = Math.round(360 / phiStepDeg);
  const thetaDeg = new Float64Array(nT * nP);
  const phiDeg = new Float64Array(nT * nP);
  const weightSr = new Float64Array(nT * nP);
  const dPhi = (2 * Math.PI) / nP;
  const rad = Math.PI / 180;
  for (let i = 0; i < nT; i++) {
    const t = i * thetaStepDeg;
    const t1 = Math.max(0, t - thetaStepDeg / 2) * rad;
    const t2 = Math.min(180, t + thetaStepDeg / 2) * rad;
    for (let j = 0; j < nP; j++) {
      const k = i * nP + j;
      thetaDeg[k] = t;
      phiDeg[k] = j * phiStepDeg;
      weightSr[k] = dPhi * (Math.cos(t1) - Math.cos(t2));
    }
  }
  return { thetaDeg, phiDeg, weightSr };
}

/** Neumaier-compensated Σ wᵢ·10^(dBᵢ/10) (linear power integral over the grid). */
export function integrateLinear(valuesDb: Float64Array, weightSr: Float64Array): number {
  let sum = 0;
  let c = 0;
  for (let i = 0; i < valuesDb.length; i++) {
    const x = weightSr[i] * 10 ** (valuesDb[i] / 10);
    const t = sum + x;
    c += Math.abs(sum) >= Math.abs(x) ? sum - t + x : x - t + sum;
    sum = t;
  }
  return sum + c;
}

/** Directivity (linear) of a pattern: 4π·max / ∮P dΩ. */
export function directivity(valuesDb: Float64Array, weightSr: Float64Array): number {
  let max = -Infinity;
  for (const v of valuesDb) if (v > max) max = v;
  return (4 * Math.PI * 10 ** (max / 10)) / integrateLinear(valuesDb, weightSr);
}

export function maxOf(a: Float64Array): number {
  let m = -Infinity;
  for (const v of a) if (v > m) m = v;
  return m;
}
