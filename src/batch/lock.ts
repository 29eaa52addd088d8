/**
 * One run at a time per output folder: a lock file holding the owner's pid, host, start time
 * and (on Linux) the process start time. A lock is stale (a killed run) and taken over when its
 * pid no longer runs, when that pid now belongs to another process, or when it is older than a
 * day; see livePid.
 */
import { linkSync, readFileSync, renameSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { hostname } from 'node:os';

export const LOCK_NAME = '.spherecov.lock';

export class LockBusyError extends Error {}

/** Is a process with this pid alive? (signal 0 only checks; EPERM means alive but not ours.) */
function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}

/** The lock file's text, or null when it does not exist (any more). */
function readText(file: string): string | null {
  try {
    return readFileSync(file, 'utf8');
  } catch {
    return null;
  }
}

/**
 * A lock older than this is taken over whatever its pid says: no run lasts a day, and a pid is
 * not proof of life (it may have been reused by an unrelated process, or belong to another host
 * sharing the folder).
 */
export const LOCK_MAX_AGE_MS = 24 * 3600 * 1000;

/**
 * Start time of process `pid` in clock ticks since boot (Linux /proc/<pid>/stat, field 22), or
 * null where /proc is not available. Together with the pid it names one process: a pid reused
 * by a later process has a later start time.
 */
export function processStartTicks(pid: number): string | null {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    // The command name (field 2) is in parentheses and may contain spaces: count after the last ')'.
    const fields = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    return fields[19] ?? null;
  } catch {
    return null;
  }
}

interface LockInfo { pid?: unknown; startedAt?: unknown; host?: unknown; procStart?: unknown }

/**
 * The pid of a live owner named in a lock text, or null when the lock is stale: unreadable (ours
 * are complete before they appear), older than LOCK_MAX_AGE_MS, written on this host by a pid
 * that no longer runs, or by a pid now held by another process (its start time differs from the
 * one recorded). A lock from another host sharing the folder cannot be checked and holds until
 * it is LOCK_MAX_AGE_MS old.
 */
function livePid(text: string, now: number = Date.now()): number | null {
  let info: LockInfo;
  try {
    info = JSON.parse(text) as LockInfo;
  } catch {
    return null;
  }
  const pid = Number(info.pid);
  if (!Number.isInteger(pid) || pid <= 0 || pid === process.pid) return null;
  const started = typeof info.startedAt === 'string' ? Date.parse(info.startedAt) : NaN;
  if (Number.isFinite(started) && now - started > LOCK_MAX_AGE_MS) return null;
  if (typeof info.host === 'string' && info.host !== hostname()) return pid;
  if (!alive(pid)) return null;
  if (typeof info.procStart === 'string') {
    const nowStart = processStartTicks(pid);
    if (nowStart !== null && nowStart !== info.procStart) return null;
  }
  return pid;
}

function busy(pid: number, dir: string): LockBusyError {
  const who = Number.isFinite(pid) ? `another spherecov run (pid ${pid})` : 'another spherecov run';
  return new LockBusyError(`${who} is writing to '${dir}'; wait for it to finish, or choose another --out`);
}

/**
 * Take the lock of `dir`, or throw LockBusyError with a message in plain words.
 * Returns the release function (idempotent).
 */
export function acquireLock(dir: string): () => void {
  const file = path.join(dir, LOCK_NAME);
  for (let attempt = 0; attempt < 5; attempt++) {
    // The lock appears under its name complete or not at all: written to a private file first,
    // then hard-linked into place (link fails with EEXIST if the name is taken, atomically), so
    // a competing run can never read a live lock while it is still empty.
    // A random private name, created exclusively ('wx': O_CREAT|O_EXCL), so a link planted in a
    // shared output folder is never followed.
    const tmp = `${file}.${randomBytes(8).toString('hex')}.tmp`;
    try {
      const info = { pid: process.pid, startedAt: new Date().toISOString(), host: hostname(), procStart: processStartTicks(process.pid) ?? undefined };
      writeFileSync(tmp, JSON.stringify(info) + '\n', { flag: 'wx' });
      try {
        linkSync(tmp, file);
      } finally {
        rmSync(tmp, { force: true });
      }
      let released = false;
      return () => {
        if (released) return;
        released = true;
        rmSync(file, { force: true });
      };
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== 'EEXIST') throw e;
      const seen = readText(file);
      if (seen === null) continue; // released between our link and our read: try again
      const owner = livePid(seen);
      if (owner !== null) throw busy(owner, dir);
      // Stale. Two runs may both find it stale: taking it over by deleting it would let the later
      // one delete the earlier one's fresh lock. So move it aside under a private name (atomic;
      // only one run gets any given file), and check that what we moved is the stale lock we read.
      const aside = `${file}.${randomBytes(8).toString('hex')}.stale`;
      try {
        renameSync(file, aside);
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === 'ENOENT') continue;
        throw err;
      }
      const moved = readText(aside);
      if (moved !== seen) {
        // We moved another run's fresh lock: put it back and yield to that run.
        try {
          linkSync(aside, file);
        } catch {
          // a third run took the name meanwhile; the lock stays taken either way
        }
        rmSync(aside, { force: true });
        throw busy(livePid(moved ?? '') ?? NaN, dir);
      }
      rmSync(aside, { force: true });
    }
  }
  throw new LockBusyError(`could not take the lock '${file}'; another run may have started at the same moment`);
}
