import { readFileSync } from 'node:fs';

/** The package version, read once from package.json (two folders up from src/batch or dist/batch). */
export const TOOL_VERSION: string = (() => {
  try {
    const pkg = JSON.parse(readFileSync(new URL('../../package.json', import.meta.url), 'utf8')) as { version?: string };
    return pkg.version ?? '0.0.0';
  } catch {
    return '0.0.0';
  }
})();
