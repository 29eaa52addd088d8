import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';

/**
 * The compiled worker script `name` beside the calling module (pass its `import.meta.url`), or
 * null when the caller runs from .ts sources (vitest: a worker thread cannot run them) or the
 * script is missing. One rule for the task pool's, the range reader's and the insight lane's
 * workers: each then runs on the calling thread instead.
 * @example compiledWorker(import.meta.url, 'worker.js') // '/…/dist/batch/worker.js' from dist, null from src
 */
export function compiledWorker(callerUrl: string, name: string): string | null {
  if (!callerUrl.endsWith('.js')) return null;
  const p = fileURLToPath(new URL(`./${name}`, callerUrl));
  return existsSync(p) ? p : null;
}
