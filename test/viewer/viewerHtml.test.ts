/**
 * The viewer.html writer: one self-contained file (no URL it could fetch, a policy that forbids
 * fetching), data that cannot break out of its <script> element, and the --no-viewer switch.
 */
import { beforeAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { ensureBuilt, ROOT } from '../cli/buildOnce.js';
import { scriptSafeJson } from '../../src/report/viewerHtml.js';

const analyze = (extra: string[]) => {
  const out = mkdtempSync(path.join(tmpdir(), 'spherecov-viewer-html-'));
  const r = spawnSync(process.execPath, [path.join(ROOT, 'bin', 'spherecov.js'), 'analyze', path.join(ROOT, 'fixtures', 'cli', 'formula'), '--out', out, '--quiet', ...extra], { encoding: 'utf8' });
  expect(r.status, r.stderr).toBe(0);
  return out;
};

beforeAll(() => ensureBuilt(), 180_000);

function pageData(out: string) {
  const html = readFileSync(path.join(out, 'viewer.html'), 'utf8');
  const json = html.slice(html.indexOf('<script type="application/json" id="spherecov-data">'));
  return JSON.parse(json.slice(json.indexOf('>') + 1, json.indexOf('</script>')));
}

describe('viewer.html', () => {
  it('is written by default, self-contained, and skipped with --no-viewer or --no-pdf', () => {
    const out = analyze([]);
    const html = readFileSync(path.join(out, 'viewer.html'), 'utf8');
    expect(html).toMatch(/<meta http-equiv="Content-Security-Policy" content="default-src 'none';/);
    // Nothing that a browser would load: no src/href attribute pointing anywhere.
    expect(html).not.toMatch(/<(script|link|img|iframe)[^>]+(src|href)=/i);
    expect(html).toContain('not a regulatory conformance or RF-exposure assessment');
    const json = html.slice(html.indexOf('<script type="application/json" id="spherecov-data">'));
    const data = JSON.parse(json.slice(json.indexOf('>') + 1, json.indexOf('</script>')));
    expect(data.units.map((u: { unit: string }) => u.unit)).toEqual(JSON.parse(readFileSync(path.join(out, 'results.json'), 'utf8')).units.map((u: { unit: string }) => u.unit));
    expect(existsSync(path.join(analyze(['--no-viewer']), 'viewer.html'))).toBe(false);
    expect(existsSync(path.join(analyze(['--no-pdf']), 'viewer.html'))).toBe(false); // JSON and CSV only
  });

  it('carries a golden unit measured elsewhere, and EIS units', () => {
    const out = mkdtempSync(path.join(tmpdir(), 'spherecov-viewer-html-'));
    const r = spawnSync(process.execPath, [path.join(ROOT, 'bin', 'spherecov.js'), 'analyze', path.join(ROOT, 'fixtures', 'cli', 'fail'), '--out', out, '--quiet',
      '--reference', path.join(ROOT, 'fixtures', 'cli', 'pass', 'U-02')], { encoding: 'utf8' });
    expect(r.status === 0 || r.status === 1, r.stderr).toBe(true);
    const data = pageData(out);
    expect(data.referenceUnits.map((u: { unit: string; beamIds: string[] }) => [u.unit, u.beamIds])).toEqual([['U-02', ['TSP']]]);
    const eis = mkdtempSync(path.join(tmpdir(), 'spherecov-viewer-html-'));
    spawnSync(process.execPath, [path.join(ROOT, 'bin', 'spherecov.js'), 'analyze', path.join(ROOT, 'fixtures', 'cli', 'eis'), '--out', eis, '--quiet'], { encoding: 'utf8' });
    expect(pageData(eis).units.map((u: { quantity: string }) => u.quantity)).toContain('eis');
  });

  it('keeps hostile text inside its JSON script element', () => {
    const nasty = { unit: '</script><script>alert(1)</script><!--\u2028' };
    const text = scriptSafeJson(nasty);
    expect(text).not.toMatch(/<\/script|<!--|\u2028/i);
    expect(JSON.parse(text)).toEqual(nasty);
  });
});
