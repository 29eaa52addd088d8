#!/usr/bin/env node
// Thin launcher: the CLI lives in src/cli (compiled to dist/cli by `npm install` / `npm run build`,
// then bundled into dist/bundle, which loads in about half the time; src/cli/bundleStamp.ts
// decides which one runs). The interrupt handlers come first, before the rest of the program
// loads, and stay installed until the process exits (a Ctrl-C at any moment stops the run
// cleanly, exit 130).
import { createRequire } from 'node:module';
import { cliModules } from '../dist/cli/bundleStamp.js';

const modules = cliModules();
const argv = process.argv.slice(2);
// A large analyze gets its worker threads started before the command line is parsed and the
// run planned (src/earlyThreads.ts).
if (modules.bundle !== null) {
  // One CommonJS file, compiled from V8's code cache; it installs the interrupt handlers first.
  const cli = createRequire(import.meta.url)(modules.bundle);
  await cli.startEarlyThreads(argv);
  await cli.main(argv);
} else {
  (await import(modules.signals)).installSignalHandlers();
  await (await import(modules.early)).startEarlyThreads(argv);
  await (await import(modules.main)).main(argv);
}
