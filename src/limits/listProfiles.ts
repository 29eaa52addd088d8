import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import type { ProfileInfo } from './limitSet.js';
import { parseLimitSetText } from './parseLimitSet.js';
import { limitTemplatesDir } from './templatesDir.js';

/**
 * The shipped limit profiles (templates/limits/*.yaml), sorted by name. A profile file that
 * does not validate is skipped here (the profile tests keep every shipped file valid).
 *
 * Cost: reads every profile file (about fifty small files).
 * @example listProfiles().some((p) => p.name === '3gpp-fr2-pc3-n257') // true
 */
export function listProfiles(): ProfileInfo[] {
  const dir = limitTemplatesDir();
  let names: string[];
  try {
    names = readdirSync(dir).filter((f) => f.endsWith('.yaml')).sort();
  } catch {
    return [];
  }
  const out: ProfileInfo[] = [];
  for (const f of names) {
    const file = join(dir, f);
    const { limitSet } = parseLimitSetText(readFileSync(file, 'utf8'), `templates/limits/${f}`);
    if (!limitSet) continue;
    out.push({
      name: limitSet.name, description: limitSet.description, quantity: limitSet.quantity,
      ...(limitSet.band ? { band: limitSet.band } : {}), checks: limitSet.checks.length,
      source: limitSet.source, file,
    });
  }
  return out.sort((a, b) => a.name.localeCompare(b.name));
}
