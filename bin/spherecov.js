#!/usr/bin/env node
// Thin launcher: the CLI lives in src/cli (compiled to dist/cli by `npm install` / `npm run build`,
// then bundled into dist/bundle, which loads in about half the time; src/cli/bundleStamp.ts
// decides which one runs). The interrupt handlers come first, before the rest of the program
// loads, and stay installed until the process exits (a Ctrl-C at any moment stops the run
// cleanly, exit 130).
import { cliModules } from '../dist/cli/bundleStamp.js';

const modules = cliModules();
const { installSignalHandlers } = await import(modules.signals);
installSignalHandlers();
// A large analyze gets its worker threads started now, while the CLI loads (src/earlyThreads.ts).
const { startEarlyThreads } = await import(modules.early);
await startEarlyThreads(process.argv.slice(2));
const { main } = await import(modules.main);
await main(process.argv.slice(2));
