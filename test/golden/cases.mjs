// The builds whose results.json, summary.csv and build-stats.csv are kept byte for byte in
// test/golden/<case>/ (goldens). Shared by the golden test and `npm run golden:update`.
// Volatile fields are normalized before comparing and before writing: the run time stamp
// (`generatedAt`), the tool version (`tool.version`) and the checkout folder in absolute paths
// (`referenceFolder`), written as <root>. Nothing else is stripped.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, existsSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const ROOT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..', '..');
export const GOLDEN_DIR = path.join(ROOT, 'test', 'golden');
const CLI = path.join(ROOT, 'fixtures', 'cli');
const LIMITS = path.join(CLI, 'limits-fixture.yaml');

/** name → analyze arguments after the input folder (every case runs with --no-pdf --quiet). */
export const CASES = [
  { name: 'demo', input: path.join(ROOT, 'fixtures', 'demo'), args: [] },
  { name: 'cli-pass', input: path.join(CLI, 'pass'), args: ['--limits', LIMITS] },
  { name: 'cli-fail', input: path.join(CLI, 'fail'), args: ['--limits', LIMITS] },
  { name: 'cli-unreadable', input: path.join(CLI, 'unreadable'), args: ['--limits', LIMITS] },
  { name: 'cli-eis', input: path.join(CLI, 'eis'), args: ['--limits', '3gpp-fr2-pc3-n257-eis-100mhz', '--coverage-thresholds=-80'] },
  { name: 'cli-formula', input: path.join(CLI, 'formula'), args: ['--coverage-thresholds=-88,-85', '--relative-db', '-3'] },
  { name: 'cli-reference', input: path.join(CLI, 'fail'), args: ['--reference', path.join(CLI, 'pass', 'U-02')] },
];

export const OUTPUT_FILES = ['results.json', 'summary.csv', 'build-stats.csv'];

/** Replace the volatile fields of results.json; other files pass unchanged. */
export function normalize(file, text) {
  if (file !== 'results.json') return text;
  return text
    .split(JSON.stringify(ROOT).slice(1, -1)).join('<root>')
    .replace(/^  "generatedAt": "[^"]*",$/m, '  "generatedAt": "<time>",')
    .replace(/^(  "tool": \{\n    "name": "spherecov",\n    "version": )"[^"]*"/m, '$1"<version>"');
}

/** Run one case with the compiled CLI; returns { code, files: { name: text | null } }. */
export function runCase(c) {
  const out = mkdtempSync(path.join(tmpdir(), `spherecov-golden-${c.name}-`));
  try {
    const r = spawnSync(process.execPath, [path.join(ROOT, 'bin', 'spherecov.js'), 'analyze', c.input, '--out', out, '--no-pdf', '--quiet', '--jobs', '1', ...c.args],
      { encoding: 'utf8' });
    const files = {};
    for (const f of OUTPUT_FILES) {
      const p = path.join(out, f);
      files[f] = existsSync(p) ? normalize(f, readFileSync(p, 'utf8')) : null;
    }
    return { code: r.status, stderr: r.stderr, files };
  } finally {
    rmSync(out, { recursive: true, force: true });
  }
}
