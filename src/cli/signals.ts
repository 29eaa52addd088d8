/**
 * Interrupt handling for the whole life of the CLI process. bin/spherecov.js installs it before
 * it loads anything else, and it is never removed: a SIGINT or SIGTERM at any moment (while the
 * modules load, while analyzing, while writing, while the worker threads shut down) is turned
 * into an abort of the run's AbortSignal and an exit code (130 for SIGINT, 143 for SIGTERM,
 * 128 + the signal number), never into the default "die of the signal" that leaves the lock and
 * temporary files behind. The run (runAnalyze) watches the AbortSignal, removes its temporary
 * files, releases its lock, and says how far it got.
 *
 * This module imports nothing heavy (node:process only) so that installing it is the first thing
 * the process does.
 */

const controller = new AbortController();
let installed = false;
let received: NodeJS.Signals | null = null;

/** Exit code of a run stopped by `sig` (the shell convention 128 + signal number). */
export function exitCodeForSignal(sig: NodeJS.Signals): number {
  return sig === 'SIGTERM' ? 143 : 130;
}

/** The first interrupting signal received, or null. */
export function receivedSignal(): NodeJS.Signals | null {
  return received;
}

/** Aborted when the process receives SIGINT or SIGTERM (after installSignalHandlers). */
export function interruptSignal(): AbortSignal {
  return controller.signal;
}

function onSignal(sig: NodeJS.Signals): void {
  if (received === null) {
    received = sig;
    // The exit code is set at once: whatever happens next, the process does not exit 0.
    process.exitCode = exitCodeForSignal(sig);
    controller.abort(sig);
  }
  // A second signal is not an emergency exit: the run is already stopping and cleaning up, and
  // stopping mid-cleanup is what would leave a lock and temporary files behind.
}

/**
 * A reader that closed its end of our stdout or stderr (`spherecov analyze --help | head`, a pager
 * quit early): Node ignores SIGPIPE, so the next write fails with EPIPE, an 'error' event that
 * would kill the process with a stack trace. Output to that stream simply stops; the run goes on
 * and writes its files (its console lines were only a report of them).
 */
function onClosedPipe(e: NodeJS.ErrnoException): void {
  if (e.code === 'EPIPE' || e.code === 'ERR_STREAM_DESTROYED') return;
  throw e;
}

/** Install the SIGINT/SIGTERM handlers and the closed-pipe rule (idempotent). Kept until the process exits. */
export function installSignalHandlers(): void {
  if (installed) return;
  installed = true;
  process.on('SIGINT', onSignal);
  process.on('SIGTERM', onSignal);
  process.stdout.on('error', onClosedPipe);
  process.stderr.on('error', onClosedPipe);
}
