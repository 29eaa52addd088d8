import { readdirSync, statSync } from 'node:fs';
import path from 'node:path';

const EXPORT_EXT = new Set(['.csv', '.tsv', '.txt']);

/**
 * Export files under a folder (recursive, .csv/.tsv/.txt, hidden entries skipped), sorted by
 * path so that runs are reproducible; a file path gives itself.
 */
export function findExportFiles(input: string): string[] {
  const abs = path.resolve(input);
  if (statSync(abs).isFile()) return [abs];
  const out: string[] = [];
  const walk = (dir: string): void => {
    for (const e of readdirSync(dir, { withFileTypes: true }).sort((a, b) => (a.name < b.name ? -1 : a.name > b.name ? 1 : 0))) {
      if (e.name.startsWith('.')) continue;
      const p = path.join(dir, e.name);
      if (e.isDirectory()) walk(p);
      else if (e.isFile() && EXPORT_EXT.has(path.extname(e.name).toLowerCase())) out.push(p);
    }
  };
  walk(abs);
  return out;
}
