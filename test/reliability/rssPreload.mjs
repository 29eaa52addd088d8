// Preload (`node --import <this file> …`): at exit the main thread writes the process's peak
// resident set size (process.resourceUsage().maxRSS, KiB, all threads) to $SPHERECOV_RSS_FILE.
import { writeFileSync } from 'node:fs';
import { isMainThread } from 'node:worker_threads';

const out = process.env.SPHERECOV_RSS_FILE;
if (out && isMainThread) process.on('exit', () => writeFileSync(out, String(process.resourceUsage().maxRSS)));
