#!/usr/bin/env node
// npm run soak: the reliability suite (test/reliability) at the full sizes: ~60 000
// fuzzed files, 40 SIGKILLs on a 12-unit batch, a ~1 GB export with its peak RSS. Builds dist/
// first, then prints the measured figures. Takes several minutes; not part of `npm test`.
import { execFileSync, spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, existsSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const figures = path.join(mkdtempSync(path.join(tmpdir(), 'spherecov-soak-')), 'figures.jsonl');
try {
  execFileSync(process.execPath, [path.join(root, 'node_modules', 'typescript', 'bin', 'tsc'), '-p', 'tsconfig.json'], { cwd: root, stdio: 'inherit' });
} catch {
  // tsc emits even with type errors elsewhere; the tests check that dist/ is there.
}
// As `npm test` does: the CLI tests then run the bundled CLI (src/cli/bundleStamp.ts).
execFileSync(process.execPath, [path.join(root, 'scripts', 'bundle.mjs')], { cwd: root, stdio: 'inherit' });
const t0 = Date.now();
const r = spawnSync(process.execPath, [path.join(root, 'node_modules', 'vitest', 'vitest.mjs'), 'run', 'test/reliability', '--testTimeout', '1800000', '--hookTimeout', '1800000'], {
  cwd: root, stdio: 'inherit', env: { ...process.env, SPHERECOV_SOAK: '1', SPHERECOV_FIGURES: figures },
});
console.log(`\nsoak finished in ${((Date.now() - t0) / 1000).toFixed(0)} s, exit ${r.status}`);
if (existsSync(figures)) {
  for (const line of readFileSync(figures, 'utf8').trim().split('\n')) {
    const { name, value } = JSON.parse(line);
    console.log(`  ${name}: ${JSON.stringify(value)}`);
  }
}
process.exitCode = r.status ?? 1;
