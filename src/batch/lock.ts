/**
 * One run at a time per output folder: a lock file holding the owner's pid. A lock whose pid
 * no longer runs is stale (a killed run) and is taken over.
 */
import { linkSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';

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

/**
 * Take the lock of `dir`, or throw LockBusyError with a message in plain words.
 * Returns the release function (idempotent).
 */
export function acquireLock(dir: string): () => void {
  const file = path.join(dir, LOCK_NAME);
  for (let attempt = 0; attempt < 2; attempt++) {
    // The lock appears under its name complete or not at all: written to a private file first,
    // then hard-linked into place (link fails with EEXIST if the name is taken, atomically), so
    // a competing run can never read a live lock while it is still empty.
    const tmp = `${file}.${process.pid}.tmp`;
    try {
      writeFileSync(tmp, JSON.stringify({ pid: process.pid, startedAt: new Date().toISOString() }) + '\n');
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
      let pid = NaN;
      try {
        pid = Number((JSON.parse(readFileSync(file, 'utf8')) as { pid?: unknown }).pid);
      } catch {
        pid = NaN; // unreadable lock: not one of ours (ours are complete before they appear), so stale
      }
      if (Number.isInteger(pid) && pid > 0 && pid !== process.pid && alive(pid)) {
        throw new LockBusyError(
          `another spherecov run (pid ${pid}) is writing to '${dir}'; wait for it to finish, or choose another --out`,
        );
      }
      rmSync(file, { force: true });
    }
  }
  throw new LockBusyError(`could not take the lock '${file}'; another run may have started at the same moment`);
}
