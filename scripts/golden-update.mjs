#!/usr/bin/env node
// `npm run golden:update`: rewrite test/golden/<case>/ from the current build. Commit the result
// with a message that says which change moved which numbers and why.
import { mkdirSync, writeFileSync, rmSync } from 'node:fs';
import path from 'node:path';
import { CASES, GOLDEN_DIR, runCase } from '../test/golden/cases.mjs';

for (const c of CASES) {
  const { code, stderr, files } = runCase(c);
  if (code !== 0 && code !== 1 && code !== 2) {
    console.error(`golden:update: case ${c.name} ended with exit code ${code}\n${stderr}`);
    process.exit(1);
  }
  const dir = path.join(GOLDEN_DIR, c.name);
  rmSync(dir, { recursive: true, force: true });
  mkdirSync(dir, { recursive: true });
  writeFileSync(path.join(dir, 'exit-code'), `${code}\n`);
  for (const [f, text] of Object.entries(files)) if (text !== null) writeFileSync(path.join(dir, f), text);
  console.error(`golden:update: ${c.name} (exit ${code}): ${Object.keys(files).filter((f) => files[f] !== null).join(', ')}`);
}
