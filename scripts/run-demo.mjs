#!/usr/bin/env node
// `npm run demo`: analyze the bundled demo build into reports/demo/. The tool itself prints the
// verdict table and the files it wrote. Exit code 1 from analyze means "a unit failed a limit",
// which is what the demo is meant to show, so only a usage/read error (2) or a crash fails it.
import { spawnSync } from 'node:child_process';
import { dirname, join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const input = relative(process.cwd(), join(root, 'fixtures', 'demo')) || '.';
const out = relative(process.cwd(), join(root, 'reports', 'demo')) || '.';

const run = spawnSync(process.execPath, [join(root, 'bin', 'spherecov.js'), 'analyze', input, '--out', out], { stdio: 'inherit' });
if (run.status !== 0 && run.status !== 1) {
  console.error(`demo: analyze ended with exit code ${run.status}`);
  process.exit(run.status ?? 2);
}
