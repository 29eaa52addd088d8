import { fileURLToPath } from 'node:url';

/**
 * Folder of the shipped limit profiles. templates/ sits at the package root, two levels above
 * this module both in src/limits (vitest) and in dist/limits (built CLI), so one relative URL
 * serves both.
 */
export function limitTemplatesDir(): string {
  return fileURLToPath(new URL('../../templates/limits/', import.meta.url));
}
