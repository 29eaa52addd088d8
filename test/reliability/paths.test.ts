/**
 * Issue 8, property 5: nothing is written outside --out; unit names from files cannot escape it
 * (sanitized in file names, verbatim in results.json); symbolic links in the input are followed
 * only inside the input folder. End-to-end through the built CLI.
 */
import { existsSync, mkdirSync, readdirSync, readFileSync, statSync, symlinkSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { ensureBuilt } from '../cli/buildOnce.js';
import { analyzeArgs, finalFiles, pdfLooksWhole, runSync, tmp } from './cliHarness.js';
import type { ResultsFile } from '../../src/types.js';

beforeAll(() => ensureBuilt(), 180_000);

const HOSTILE = ['../../etc/x', '/abs/spherecov-escape', 'CON', 'a:b', '..', 'summary', 'nul.txt', 'C:\\Windows\\x', 'ü/../ß'];

/** Long-layout rows of one unit on a 30° grid (full sphere), values from a smooth lobe. */
function unitRows(unit: string, p0: number): string[] {
  const rows: string[] = [];
  for (let t = 0; t <= 180; t += 30) for (let p = 0; p < 360; p += 30) rows.push(`"${unit}",${t},${p},0,${(p0 - 0.05 * Math.abs(t - 90)).toFixed(2)}`);
  return rows;
}

function listAll(dir: string, base = dir): string[] {
  const out: string[] = [];
  for (const e of readdirSync(dir, { withFileTypes: true })) {
    const p = path.join(dir, e.name);
    out.push(path.relative(base, p));
    if (e.isDirectory() && !e.isSymbolicLink()) out.push(...listAll(p, base));
  }
  return out.sort();
}

describe('paths', () => {
  it('hostile unit names stay inside --out: sanitized file names, verbatim JSON, nothing written elsewhere', () => {
    const sandbox = tmp('paths');
    const input = path.join(sandbox, 'in');
    const out = path.join(sandbox, 'deep', 'out');
    mkdirSync(input);
    writeFileSync(path.join(input, 'hostile_28GHz.csv'), ['unit,theta_deg,phi_deg,beam,eirp_dbm', ...HOSTILE.flatMap((u, i) => unitRows(u, 20 + i))].join('\n') + '\n');
    const before = listAll(sandbox);
    const r = runSync(analyzeArgs(input, out));
    expect(r.stderr).toBe('');
    expect(r.code).toBe(0);
    // Only the output folder is new in the sandbox, and it holds plain, safe file names only.
    const added = listAll(sandbox).filter((f) => !before.includes(f));
    expect(added.every((f) => f === 'deep' || f === path.join('deep', 'out') || path.dirname(f) === path.join('deep', 'out'))).toBe(true);
    for (const f of readdirSync(out)) {
      expect(statSync(path.join(out, f)).isFile()).toBe(true);
      expect(f).toMatch(/^[A-Za-z0-9._-]+$/);
      expect(f.startsWith('-')).toBe(false);
    }
    expect(existsSync('/abs')).toBe(false);
    const pdfs = finalFiles(out).filter((f) => f.endsWith('.pdf'));
    expect(pdfs).toHaveLength(HOSTILE.length + 1);
    for (const f of pdfs) expect(pdfLooksWhole(readFileSync(path.join(out, f)))).toBe(true);
    // Reserved device names and our own output names are never used as a stem.
    // (Windows refuses a name whose part before the first dot is a device name.)
    for (const f of readdirSync(out)) expect(f.split('.')[0]).not.toMatch(/^(con|prn|aux|nul|com\d|lpt\d)$/i);
    expect(pdfs.filter((f) => f === 'summary.pdf')).toHaveLength(1);
    const results = JSON.parse(readFileSync(path.join(out, 'results.json'), 'utf8')) as ResultsFile;
    expect(results.units.map((u) => u.unit).sort()).toEqual([...HOSTILE].sort());
  }, 120_000);

  it('symbolic links are followed only inside the input folder', () => {
    const sandbox = tmp('links');
    const input = path.join(sandbox, 'in');
    const outside = path.join(sandbox, 'elsewhere');
    mkdirSync(path.join(input, 'store', 'U-IN'), { recursive: true });
    mkdirSync(path.join(outside, 'U-OUT'), { recursive: true });
    const rows = (u: string) => ['unit,theta_deg,phi_deg,beam,eirp_dbm', ...unitRows(u, 21)].join('\n') + '\n';
    writeFileSync(path.join(input, 'store', 'U-IN', 'b0.csv'), rows('U-IN'));
    writeFileSync(path.join(outside, 'U-OUT', 'b0.csv'), rows('U-OUT'));
    writeFileSync(path.join(outside, 'secret.csv'), rows('U-SECRET'));
    symlinkSync(path.join(input, 'store', 'U-IN'), path.join(input, 'linked-in'));
    symlinkSync(path.join(outside, 'U-OUT'), path.join(input, 'linked-out'));
    symlinkSync(path.join(outside, 'secret.csv'), path.join(input, 'secret.csv'));
    symlinkSync('../../..', path.join(input, 'store', 'up'));
    const out = path.join(sandbox, 'out');
    const r = runSync(analyzeArgs(input, out, ['--no-pdf']));
    expect(r.code).toBe(0);
    const results = JSON.parse(readFileSync(path.join(out, 'results.json'), 'utf8')) as ResultsFile;
    expect(results.units.map((u) => u.unit)).toEqual(['U-IN']);
    expect([...results.settings.skippedLinks].sort()).toEqual(['linked-out', 'secret.csv', 'store/up']);
  }, 120_000);
});
