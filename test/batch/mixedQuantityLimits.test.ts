/**
 * A build with EIRP and EIS units and one limit set written for EIRP: the set judges only the EIRP
 * units (the EIS units' checks are not evaluable), so its dBm values must not steer the EIS units'
 * analysis either — their hole threshold comes from the requested thresholds, and they get no
 * coverage at the set's percentile limit (src/limits/impliedChoices.ts limitSetFor).
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { runAnalyze } from '../../src/batch/runAnalyze.js';
import { limitSetFor } from '../../src/limits/impliedChoices.js';

const ROOT = path.resolve(__dirname, '../..');
const dir = mkdtempSync(path.join(tmpdir(), 'spherecov-mixed-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe('one EIRP limit set over a build with EIRP and EIS units', () => {
  it('limitSetFor keeps a set only for its own quantity', () => {
    const eirp = { quantity: 'eirp' as const, checks: [] };
    expect(limitSetFor(eirp, 'eirp')).toBe(eirp);
    expect(limitSetFor(eirp, 'eis')).toBeNull();
    expect(limitSetFor(null, 'eirp')).toBeNull();
  });

  it("EIS units take the requested threshold; EIRP units the set's min-coverage threshold", async () => {
    const { results } = await runAnalyze({
      input: path.join(ROOT, 'fixtures/cli/bc'), outDir: path.join(dir, 'out'), pdf: false, jobs: 1,
      limits: path.join(ROOT, 'fixtures/cli/limits-fixture.yaml'), thresholds: [-90, 5],
      io: { stdout: () => undefined, stderr: () => undefined, stderrIsTTY: false },
    });
    const eis = results.units.filter((u) => u.quantity === 'eis');
    const eirp = results.units.filter((u) => u.quantity === 'eirp');
    expect(eis.length).toBe(2);
    expect(eirp.length).toBe(2);
    for (const u of eirp) {
      expect(u.analysisThreshold).toEqual({ value: 10, source: 'min-coverage-check', toleranceApplied: false });
      expect(u.tsp.coverageAtLevelLimit).toMatchObject({ levelPct: 50, threshold: 15 });
    }
    for (const u of eis) {
      expect(u.analysisThreshold).toEqual({ value: -90, source: 'requested', toleranceApplied: false });
      expect(u.tsp.coverageAtLevelLimit ?? null).toBeNull();
      expect(u.checks.every((c) => c.status === 'not-evaluable')).toBe(true);
      // The holes are found at that threshold: EIS worse (higher) than −90 dBm somewhere on these units.
      for (const h of u.holes) expect(h.worst).toBeGreaterThan(-90);
    }
  });
});
