/**
 * EIS θ/φ pairs: each polarization judged on its own, never power-summed; the named
 * combined-sensitivity view; EIRP pairs keep the power-sum total.
 * Sources: the reference notes (../shared/reference/fr2-requirements.md, "Receive requirements
 * and polarization", from 3GPP TS 38.101-2 §7: receive requirements hold in each of two
 * orthogonal polarizations) and plain linear algebra of powers (1/x + 1/x = 2/x → 10·log10 2 dB).
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { combinedSensitivityDbm } from '../../src/coverage/combinedSensitivity.js';
import { readExportFile } from '../../src/io/readExportFile.js';
import { assembleMeasurements } from '../../src/io/assembleMeasurements.js';
import { planPolarizations } from '../../src/batch/polarizationUnits.js';
import { expectClose } from '../helpers/expectClose.js';

/** A tiny pair export on a 30° grid with constant components (θ, φ) in dBm. */
function pairFile(quantity: 'eis' | 'eirp', theta: number, phi: number, layout: 'pair' | 'column' = 'pair'): string {
  const dir = mkdtempSync(path.join(tmpdir(), 'spherecov-pol-'));
  const lines = [layout === 'pair' ? `theta_deg,phi_deg,${quantity}_theta_dbm,${quantity}_phi_dbm` : `theta_deg,phi_deg,pol,${quantity}_dbm`];
  for (let t = 0; t <= 180; t += 30) {
    for (let f = 0; f < 360; f += 30) {
      if (layout === 'pair') lines.push(`${t},${f},${theta},${phi}`);
      else lines.push(`${t},${f},theta,${theta}`, `${t},${f},phi,${phi}`);
    }
  }
  const file = path.join(dir, 'U-9_beam0_28GHz.csv');
  writeFileSync(file, lines.join('\n') + '\n');
  return file;
}

describe('combined-sensitivity view (1/EIS = 1/EISθ + 1/EISφ, linear power)', () => {
  it('two equal polarizations give a value 10·log10(2) = 3.0103 dB better (lower) than either', () => {
    expectClose(combinedSensitivityDbm(-90, -90), -90 - 10 * Math.log10(2), 1e-12, 'linear algebra: 1/(2/x) = x/2');
    expectClose(10 * Math.log10(2), 3.0103, 5e-5, 'the 3.01 dB of the reference notes');
  });
  it('matches the harmonic sum of the linear powers for unequal values, and a missing component leaves the other', () => {
    const mw = (dbm: number) => 10 ** (dbm / 10);
    const want = 10 * Math.log10(1 / (1 / mw(-90) + 1 / mw(-84)));
    expectClose(combinedSensitivityDbm(-90, -84), want, 1e-12, 'direct linear evaluation');
    expectClose(combinedSensitivityDbm(-84, -90), want, 1e-12, 'symmetric');
    expect(combinedSensitivityDbm(-90, Infinity)).toBe(-90);
  });
});

describe('an EIS pair is never power-summed', () => {
  for (const layout of ['pair', 'column'] as const) {
    it(`${layout} layout: −90/−90 dBm reads as two components of −90 dBm, no −86.99 dBm total`, async () => {
      const file = pairFile('eis', -90, -90, layout);
      const r = await readExportFile(file, { inputRoot: path.dirname(file) });
      expect(r.errors).toEqual([]);
      expect(r.beams.map((b) => b.polarization)).toEqual(['theta', 'phi']);
      for (const b of r.beams) expect([...new Set(b.values)]).toEqual([-90]);
      const asm = assembleMeasurements(r.beams, [{ path: r.file, sha256: r.sha256 }]);
      expect(asm.measurements.map((m) => [m.quantity, m.polarization])).toEqual([['eis', 'theta'], ['eis', 'phi']]);
      const all = asm.measurements.flatMap((m) => m.beams.flatMap((b) => [...b.values]));
      expect(all.some((v) => Math.abs(v - (-90 + 10 * Math.log10(2))) < 0.01)).toBe(false);
      // Default plan: judged per polarization; the combined view only when asked for.
      expect(planPolarizations(asm.measurements, 'each').plans.map((p) => p.rule)).toEqual(['each']);
      const combined = planPolarizations(asm.measurements, 'combined').plans;
      expect(combined.map((p) => p.rule)).toEqual(['combined-sensitivity']);
      expectClose(combined[0].main.beams[0].values[0], -90 - 10 * Math.log10(2), 1e-12, 'combined view of equal components');
    });
  }
  it('an EIRP pair keeps its power-sum total (TS 38.101-2 total component) and both components', async () => {
    const file = pairFile('eirp', 10, 10);
    const r = await readExportFile(file, { inputRoot: path.dirname(file) });
    expect(r.beams.map((b) => b.polarization)).toEqual([undefined, 'theta', 'phi']);
    expectClose(r.beams[0].values[0], 10 + 10 * Math.log10(2), 1e-12, 'power sum of two equal components');
    const asm = assembleMeasurements(r.beams, [{ path: r.file, sha256: r.sha256 }]);
    const plans = planPolarizations(asm.measurements, 'combined').plans;
    expect(plans.map((p) => [p.rule, p.main.polarization, p.components.map((c) => c.polarization)]))
      .toEqual([['total-power-sum', undefined, ['theta', 'phi']]]);
  });
});
