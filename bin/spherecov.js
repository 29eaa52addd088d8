#!/usr/bin/env node
// Thin launcher: the CLI lives in src/cli (compiled to dist/cli by `npm install` / `npm run build`).
import { main } from '../dist/cli/main.js';

main(process.argv.slice(2));
