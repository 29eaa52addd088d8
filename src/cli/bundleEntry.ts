/**
 * Entry of the bundled CLI (scripts/bundle.mjs → dist/bundle/main.js, loaded by
 * bin/spherecov.js): the interrupt handlers, installed as the file loads (signalsFirst.ts), the
 * early worker threads and the CLI itself, one module instance of each in one file.
 */
import './signalsFirst.js';

export { startEarlyThreads } from '../earlyThreads.js';
export { main } from './main.js';
