#!/usr/bin/env node
// Thin launcher: the CLI lives in src/cli (compiled to dist/cli by `npm install` / `npm run build`).
// The interrupt handlers come first, before the rest of the program loads, and stay installed
// until the process exits (a Ctrl-C at any moment stops the run cleanly, exit 130).
import { installSignalHandlers } from '../dist/cli/signals.js';

installSignalHandlers();
const { main } = await import('../dist/cli/main.js');
await main(process.argv.slice(2));
