/**
 * Standard normal cumulative distribution Φ(x) = P(Z ≤ x), Z ~ N(0, 1).
 *
 * Formula: Φ(x) = ½·erfc(−x/√2), evaluated with Hart's double-precision rational approximation
 * (Hart et al., Computer Approximations, 1968, algorithm 5666, as restated by G. West, "Better
 * approximations to cumulative normal functions", Wilmott, 2005 — coefficients from memory,
 * checked in test/analysis/uncertainty/normalCdf.test.ts against simple-statistics'
 * errorFunction and against printed table values): a ratio of polynomials times e^(−x²/2) for
 * |x| < 7.07, a continued fraction beyond, 0 below −37.                               Eq. (N1)
 * Units: x dimensionless (a value in standard deviations). Boundary rule: Φ(−x) = 1 − Φ(x)
 * by construction; NaN gives NaN. Accuracy ~1e−14 absolute.
 * Cost O(1).
 * @example normalCdf(-1.96) // 0.0249978951…
 */
export function normalCdf(x: number): number {
  if (Number.isNaN(x)) return NaN;
  const a = Math.abs(x);
  let c: number;
  if (a > 37) c = 0;
  else {
    const e = Math.exp(-(a * a) / 2);
    if (a < 7.07106781186547) {
      let n = 3.52624965998911e-2 * a + 0.700383064443688;
      n = n * a + 6.37396220353165;
      n = n * a + 33.912866078383;
      n = n * a + 112.079291497871;
      n = n * a + 221.213596169931;
      n = n * a + 220.206867912376;
      let d = 8.83883476483184e-2 * a + 1.75566716318264;
      d = d * a + 16.064177579207;
      d = d * a + 86.7807322029461;
      d = d * a + 296.564248779674;
      d = d * a + 637.333633378831;
      d = d * a + 793.826512519948;
      d = d * a + 440.413735824752;
      c = (e * n) / d; // Eq. (N1)
    } else {
      let f = a + 0.65;
      f = a + 4 / f;
      f = a + 3 / f;
      f = a + 2 / f;
      f = a + 1 / f;
      c = e / f / 2.506628274631; // Eq. (N1), continued fraction tail
    }
  }
  return x > 0 ? 1 - c : c;
}

/** Standard normal density φ(x) = e^(−x²/2)/√(2π). Cost O(1). @example normalPdf(0) // 0.3989… */
export function normalPdf(x: number): number {
  return Math.exp(-(x * x) / 2) / Math.sqrt(2 * Math.PI);
}
