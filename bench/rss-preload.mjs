// Preload (`node --import <this file> …`) that records the process's peak resident set size.
// At exit the main thread writes {"maxRssKiB": n, "cpuS": user + system CPU seconds} to the file
// named by BENCH_RSS_FILE.
// process.resourceUsage().maxRSS is the whole process's high-water mark (all threads, so worker
// threads of `--jobs N` are included), in KiB (getrusage ru_maxrss on Linux).
// Workers run this preload too (they inherit execArgv); only the main thread writes.
import { writeFileSync } from 'node:fs';
import { isMainThread } from 'node:worker_threads';

const out = process.env.BENCH_RSS_FILE;
if (out && isMainThread) {
  process.on('exit', () => {
    const u = process.resourceUsage();
    writeFileSync(out, JSON.stringify({ maxRssKiB: u.maxRSS, cpuS: (u.userCPUTime + u.systemCPUTime) / 1e6 }));
  });
}
