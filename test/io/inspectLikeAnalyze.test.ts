/**
 * inspect shows the units analyze will judge: the same files (test/io/oneWalker.test.ts) and the
 * same unit and beam names, in one Unicode form (src/io/nfcIdentity.ts).
 */
import { afterAll, describe, expect, it } from 'vitest';
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { formatInspect, inspectInput } from '../../src/io/inspectInput.js';
import { runAnalyze } from '../../src/batch/runAnalyze.js';

const sandbox = mkdtempSync(path.join(tmpdir(), 'spherecov-inspect-'));
afterAll(() => rmSync(sandbox, { recursive: true, force: true }));

/** A constant-level beam on a 30° grid. */
function exportText(level: number): string {
  const out = ['theta_deg,phi_deg,eirp_dbm'];
  for (let t = 0; t <= 180; t += 30) for (let f = 0; f < 360; f += 30) out.push(`${t},${f},${level}`);
  return out.join('\n') + '\n';
}

describe('inspect and analyze name units alike', () => {
  it('a unit folder written in NFC and in NFD is one unit to both', async () => {
    const nfc = 'Caf\u00e9-01';
    const nfd = 'Cafe\u0301-01';
    const input = path.join(sandbox, 'in');
    mkdirSync(path.join(input, nfc), { recursive: true });
    mkdirSync(path.join(input, nfd), { recursive: true });
    writeFileSync(path.join(input, nfc, 'beam1.csv'), exportText(10));
    writeFileSync(path.join(input, nfd, 'beam2.csv'), exportText(12));
    writeFileSync(path.join(input, 'U-02_beam1.csv'), exportText(9));
    const seen = await inspectInput(input);
    const { results } = await runAnalyze({ input, outDir: path.join(sandbox, 'out'), pdf: false, jobs: 1, percentilesPct: [50] });
    const fromInspect = seen.measurements.map((m) => ({ unit: m.unit, frequencyHz: m.frequencyHz, quantity: m.quantity, beams: [...m.beams].sort() }));
    const fromAnalyze = results.units.map((u) => ({ unit: u.unit, frequencyHz: u.frequencyHz, quantity: u.quantity, beams: u.beams.map((b) => b.id).sort() }));
    expect(fromInspect).toEqual(fromAnalyze);
    expect(fromInspect.map((m) => m.unit)).toEqual([nfc, 'U-02']);
    expect(fromInspect[0].beams).toEqual(['1', '2']);
  });
});

describe('inspect shows what analyze would say about the job file', () => {
  it('a key in the old spelling: inspect lists the same deprecation notice analyze prints, and reads the job', async () => {
    const input = path.join(sandbox, 'old-job');
    mkdirSync(input, { recursive: true });
    writeFileSync(path.join(input, 'U-01_beam1.csv'), exportText(10));
    writeFileSync(path.join(input, 'spherecov.yaml'), 'coverageThresholds: [8]\n');
    const seen = await inspectInput(input);
    const notice = "spherecov.yaml:1:1: coverageThresholds: found 'coverageThresholds', expected coverage_thresholds (the old spelling is still read but deprecated: configuration keys are snake_case)";
    expect(seen.job.errors).toEqual([]);
    expect(seen.job.notices.map((n) => n.message)).toEqual([notice]);
    expect(formatInspect(seen).split('\n')).toContain(`  notice: ${notice}`);
    const stderr: string[] = [];
    const { results } = await runAnalyze({
      input, outDir: path.join(sandbox, 'out-old-job'), pdf: false, jobs: 1,
      io: { stdout: () => undefined, stderr: (s: string) => void stderr.push(s), stderrIsTTY: false },
    });
    expect(results.settings.warnings.some((w) => w.endsWith(notice))).toBe(true);
    expect(results.settings.coverageThresholds).toEqual([8]);
  });
});
