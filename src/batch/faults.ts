/**
 * Test hooks for failures a test cannot produce on demand on a shared CI machine: a full disk, a
 * refused permission, a run held at an exact moment so that a signal lands there and nowhere
 * else. Read once from the environment variable SPHERECOV_TEST_FAULTS, a comma-separated list of
 * `<what>:<where>`:
 *   - `<what>` is an errno code name (ENOSPC, EACCES, EIO, …): the file-system call for
 *     `<where>` fails with that code, exactly as the operating system would report it;
 *   - `<what>` is `pause`: the run writes `spherecov: test pause before <where>` to stderr and
 *     waits there until it is interrupted (SIGINT/SIGTERM).
 * `<where>` is an output file name (`summary.pdf`, `results.json`, …), `spool` (a unit's PDF
 * parked while the analysis goes on), `manifest`, or `analysis` (the start of the analyzing
 * stage, after the output folder was locked), or `folder:<path>` (listing that input subfolder,
 * its path relative to the input, for example `folder:PX-02`).
 * Unset (the normal case) it does nothing. Never used by the program itself.
 */

interface Fault { what: string; where: string }

let parsed: Fault[] | null = null;

function faults(): Fault[] {
  if (parsed === null) {
    parsed = (process.env.SPHERECOV_TEST_FAULTS ?? '')
      .split(',')
      .map((s) => s.trim())
      .filter((s) => s.includes(':'))
      .map((s) => ({ what: s.slice(0, s.indexOf(':')), where: s.slice(s.indexOf(':') + 1) }));
  }
  return parsed;
}

/** An Error shaped like the one node:fs throws for `code` (what the real failure would give). */
export function errnoError(code: string, syscall: string, file: string): NodeJS.ErrnoException {
  const e = new Error(`${code}: injected failure, ${syscall} '${file}'`) as NodeJS.ErrnoException;
  e.code = code;
  e.syscall = syscall;
  e.path = file;
  return e;
}

/**
 * Apply the faults configured for `where` (synchronous part: an injected errno error).
 * @throws the injected errno error
 */
export function injectFaultSync(where: string, syscall: string, file: string): void {
  for (const f of faults()) {
    if (f.where === where && /^E[A-Z]+$/.test(f.what)) throw errnoError(f.what, syscall, file);
  }
}

/**
 * Apply the faults configured for `where`: throw an injected errno error, or pause until `signal`
 * aborts (then return; the caller's own interrupt check stops the run).
 */
export async function injectFault(
  where: string,
  syscall: string,
  file: string,
  signal: AbortSignal | undefined,
  stderr: (t: string) => void,
): Promise<void> {
  injectFaultSync(where, syscall, file);
  if (!faults().some((f) => f.where === where && f.what === 'pause')) return;
  stderr(`spherecov: test pause before ${where}\n`);
  if (!signal || signal.aborted) return;
  await new Promise<void>((resolve) => {
    // The timer keeps the event loop alive while nothing else is pending.
    const keepAlive = setInterval(() => undefined, 60_000);
    signal.addEventListener('abort', () => {
      clearInterval(keepAlive);
      resolve();
    }, { once: true });
  });
}
