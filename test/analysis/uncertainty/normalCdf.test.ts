import { describe, it } from 'vitest';
import { errorFunction } from 'simple-statistics';
import { normalCdf } from '../../../src/analysis/uncertainty/normalCdf.js';
import { expectClose } from '../../helpers/expectClose.js';

describe('normalCdf', () => {
  it('agrees with simple-statistics errorFunction, Φ(x) = (1 + erf(x/√2))/2', () => {
    // Outside reference: simple-statistics errorFunction (Numerical Recipes erfc, fractional error < 1.2e-7).
    for (let x = -6; x <= 6; x += 0.05) {
      expectClose(normalCdf(x), (1 + errorFunction(x / Math.SQRT2)) / 2, 1.5e-7, `Φ(${x.toFixed(2)}) vs simple-statistics (its accuracy 1.2e-7)`);
    }
  });
  it('reproduces printed table values', () => {
    // Abramowitz & Stegun Table 26.1 (from memory, 10 digits): Φ(1), Φ(−1.96), Φ(−3).
    expectClose(normalCdf(1), 0.8413447461, 1e-10, 'A&S 26.1, 10 digits');
    expectClose(normalCdf(-1.96), 0.0249978951, 1e-10, 'A&S 26.1, 10 digits');
    expectClose(normalCdf(-3), 0.0013498980, 1e-10, 'A&S 26.1, 10 digits');
    expectClose(normalCdf(0), 0.5, 1e-15, 'symmetry');
  });
  it('gives the issue check values: Φ(−0.65·1.96) = 10.1 %, Φ(−0.4·1.96) = 21.7 %', () => {
    // 3GPP RAN5 R5-193262 fail rates of a marginal UE (TT = 0.65·MU and 0.4·MU, MU = 1.96·u), derived.
    expectClose(normalCdf(-0.65 * 1.96), 0.101, 5e-4, 'rounded to 0.1 % in the source');
    expectClose(normalCdf(-0.4 * 1.96), 0.217, 5e-4, 'rounded to 0.1 % in the source');
  });
});
