/**
 * CPU time readers, the machine's and this process's, and the first reading of both. Node's
 * built-ins only, so that bin/spherecov.js takes that first reading before the CLI loads (through
 * src/earlyThreads.ts): the window over which the plan judges whether other processes leave a
 * core free (src/batch/analyzePlan.ts readThreads, src/batch/pool.ts coresFreeOfOthers) then
 * spans the program's start-up, ~60–80 ms, not the ~10–20 ms between loading the planner and
 * planning. The machine's times tick in 10 ms steps a core (Linux /proc/stat), so over that short
 * window the idle share read anywhere from 0.3 to 3.3 free cores on a quiet 2-core machine
 * (10 runs of the 64-beam export, 2026-12-02), and about one run in ten read the second core as
 * busy and kept the read and the insight lane on one thread.
 */
import { cpus } from 'node:os';

/** Idle and total CPU time summed over the machine's cores (os.cpus(), ms). */
export interface CpuTimes { idleMs: number; totalMs: number }

export function cpuTimes(): CpuTimes {
  let idleMs = 0, totalMs = 0;
  for (const c of cpus()) {
    idleMs += c.times.idle;
    totalMs += c.times.user + c.times.nice + c.times.sys + c.times.idle + c.times.irq;
  }
  return { idleMs, totalMs };
}

/** CPU time of this whole process (every thread: main, workers, V8's compiler and GC threads), ms. */
export function ownCpuMs(): number {
  const u = process.cpuUsage();
  return (u.user + u.system) / 1000;
}

/** Both readings when this module first loaded: at program start from bin/spherecov.js, else when a library caller first loaded the batch. */
export const programStart: Readonly<{ cpu: CpuTimes; ownMs: number }> = Object.freeze({ cpu: cpuTimes(), ownMs: ownCpuMs() });
