#!/usr/bin/env node
// Thin launcher: the CLI lives in src/cli (compiled to dist/cli by `npm install` / `npm run build`,
// then bundled into dist/bundle, which loads in about half the time; src/cli/bundleStamp.ts
// decides which one runs). The interrupt handlers come first, before the rest of the program
// loads, and stay installed until the process exits (a Ctrl-C at any moment stops the run
// cleanly, exit 130).
import { createRequire } from 'node:module';
import { cliModules } from '../dist/cli/bundleStamp.js';

const modules = cliModules();
let cli;
if (modules.bundle !== null) {
  // One CommonJS file, compiled from V8's code cache; it installs the interrupt handlers first.
  cli = createRequire(import.meta.url)(modules.bundle);
} else {
  const { installSignalHandlers } = await import(modules.signals);
  installSignalHandlers();
  cli = { ...(await import(modules.early)), main: null };
}
// A large analyze gets its worker threads started now, while the CLI loads (src/earlyThreads.ts).
await cli.startEarlyThreads(process.argv.slice(2));
const main = cli.main ?? (await import(modules.main)).main;
await main(process.argv.slice(2));
