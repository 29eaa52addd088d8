import { lazyPackage } from '../lazyPackage.js';

/**
 * papaparse, loaded with `require` on first use (src/lazyPackage.ts) rather than imported: it is a
 * CommonJS package, and an ES `import` makes Node scan its source for named exports first — about
 * 14–17 ms of CPU against 2.5 ms for `require` (node 20, quiet 2-core machine, 3 runs each), paid
 * by every process and worker that reads a file (the header sniff parses with it). One loader for
 * the readers and the CSV writer.
 */
export const papa = lazyPackage<typeof import('papaparse')>('papaparse');
