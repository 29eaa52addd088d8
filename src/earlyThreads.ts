/**
 * Worker threads started by bin/spherecov.js before the command line is parsed and the run
 * planned, for an `analyze` of large files: the second reading thread (src/io/rangeWorker.ts)
 * and the insight lane (src/batch/insightWorker.ts). A worker thread takes tens of milliseconds
 * from `new Worker` to running code (Node's bootstrap and its module graph; ~50 ms on the bench
 * machine with the bundle's code cache), about as long as the main thread then spends parsing,
 * planning and sniffing the file while the second core idles; started here, the workers are
 * ready when the read begins instead of starting then and competing with it. From the bundle
 * they start once its one file has loaded (~25 ms); from dist/ nothing starts early. Whoever would start such a worker takes the
 * early one instead (takeEarlyThread, src/earlyWorkers.ts) and sends its job by message; one that nobody takes (a
 * run that decided on one thread, a small file after all) is unreferenced and never keeps the
 * process alive.
 *
 * The guess is cheap and may be wrong either way: it stats the command line's existing paths
 * (a folder two levels deep, at most EARLY_SCAN_ENTRIES entries) and starts a worker only when
 * one file reaches the size at which the run would start it (PARALLEL_MIN_BYTES, LANE_MIN_BYTES);
 * results never depend on it.
 */
import { readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { Worker } from 'node:worker_threads';
import { compiledWorker } from './compiledWorker.js';
import { hasEarlyThread, offerEarlyThread } from './earlyWorkers.js';
import { OPTIONS, type OptionSpec } from './cli/options.js';
// The first CPU readings, taken as the program starts (src/cpuClock.ts programStart).
import './cpuClock.js';

/** Directory entries the size guess looks at, at most (a large build folder is not walked whole). */
export const EARLY_SCAN_ENTRIES = 2000;



/**
 * Start the early workers an `analyze` command line suggests (none for any other command, with
 * --jobs 1, or when this module does not run from the bundle).
 */
export async function startEarlyThreads(argv: readonly string[]): Promise<void> {
  const plan = await earlyPlan(argv);
  if (plan.range) start('rangeWorker.js');
  if (plan.lane) start('insightWorker.js');
}

/**
 * Which early workers a command line suggests: the second reading thread, the insight lane. The
 * size thresholds' modules (the reader's, the lane's) load only for an analyze that may start
 * one, so other commands (--version, inspect, limits) do not load them at start-up.
 */
export async function earlyPlan(argv: readonly string[]): Promise<{ range: boolean; lane: boolean }> {
  if (argv[0] !== 'analyze' || jobsIsOne(argv)) return { range: false, lane: false };
  const largest = largestFile(argv.slice(1).filter((a) => !a.startsWith('-')));
  const [{ PARALLEL_MIN_BYTES }, { LANE_MIN_BYTES }] = await Promise.all([import('./io/readInParallel.js'), import('./batch/insightLane.js')]);
  return { range: largest >= PARALLEL_MIN_BYTES, lane: largest >= LANE_MIN_BYTES && !argv.includes('--core-only') };
}

function start(name: string): void {
  const script = compiledWorker(import.meta.url, name);
  if (script === null || hasEarlyThread(script)) return;
  try {
    offerEarlyThread(script, new Worker(script, { workerData: null }));
  } catch {
    // The run starts its own worker (or reads on one thread), as without this module.
  }
}

const JOBS = OPTIONS.find((o) => o.name === 'jobs') as OptionSpec;

/** `--jobs 1` in any spelling commander takes: --jobs 1, --jobs=1, -j 1, -j1 (the short flag from cli/options.ts). */
function jobsIsOne(argv: readonly string[]): boolean {
  const long = `--${JOBS.name}`;
  const short = JOBS.short === undefined ? null : `-${JOBS.short}`;
  return argv.some((a, i) => a === `${long}=1` || (short !== null && a === `${short}1`) || ((a === long || a === short) && argv[i + 1] === '1'));
}

/** Size of the largest file among `paths` and the files up to two folder levels below them. */
function largestFile(paths: string[]): number {
  let largest = 0;
  let budget = EARLY_SCAN_ENTRIES;
  const visit = (p: string, depth: number): void => {
    if (budget-- <= 0) return;
    try {
      const st = statSync(p);
      if (st.isFile()) largest = Math.max(largest, st.size);
      else if (st.isDirectory() && depth < 2) for (const name of readdirSync(p)) visit(path.join(p, name), depth + 1);
    } catch {
      // Not a path (an option's value) or unreadable: the run reports what matters.
    }
  };
  for (const p of paths) visit(p, 0);
  return largest;
}
