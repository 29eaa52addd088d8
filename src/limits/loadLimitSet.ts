import { existsSync, statSync } from 'node:fs';
import { basename, extname, join } from 'node:path';
import { readTrustedText, resolveNamed, TrustedFileError } from '../io/trustedFile.js';
import type { InputError } from '../types.js';
import type { LimitSet } from './limitSet.js';
import { parseLimitSetText } from './parseLimitSet.js';
import { limitTemplatesDir } from './templatesDir.js';
import { listProfiles } from './listProfiles.js';

const EXTENSIONS = ['.yaml', '.yml', '.json'];

/**
 * Load a limit set by shipped profile name (`3gpp-fr2-pc3-n257`) or by path to a YAML/JSON file.
 * A value that names an existing file, contains a path separator or ends in .yaml/.yml/.json is
 * a path, relative to `baseDir`: the job file's folder when the job file names it, the working
 * directory for --limits. Anything else is a profile name. The file is read across the trust
 * boundary (io/trustedFile.ts: a regular file of at most 1 MiB; no FIFO, device or folder).
 *
 * Keys in the old camelCase spelling are read, each with a deprecation notice (`notices`).
 * Cost: one file read. Never throws: problems come back as InputError values.
 * @example loadLimitSet('3gpp-fr2-pc3-n257').limitSet?.quantity // 'eirp'
 */
export function loadLimitSet(nameOrPath: string, baseDir: string = process.cwd()): { limitSet: LimitSet | null; errors: InputError[]; notices: InputError[] } {
  const looksLikePath = /[\\/]/.test(nameOrPath) || EXTENSIONS.includes(extname(nameOrPath).toLowerCase());
  const asPath = resolveNamed(nameOrPath, baseDir);
  let file: string;
  let shown: string;
  if (looksLikePath || (existsSync(asPath) && statSync(asPath).isFile())) {
    file = asPath;
    shown = nameOrPath;
  } else {
    file = join(limitTemplatesDir(), `${nameOrPath}.yaml`);
    shown = `templates/limits/${nameOrPath}.yaml`;
    if (!existsSync(file)) return { limitSet: null, errors: [unknownProfile(nameOrPath)], notices: [] };
  }
  let text: string;
  try {
    text = readTrustedText(file, 'limit set', shown);
  } catch (e) {
    if (!(e instanceof TrustedFileError)) throw e;
    return { limitSet: null, errors: [{ file: shown, message: e.message }], notices: [] };
  }
  const out = parseLimitSetText(text, shown);
  if (out.limitSet) out.limitSet.file = file;
  return out;
}

function unknownProfile(name: string): InputError {
  const names = listProfiles().map((p) => p.name);
  // Suggest profiles sharing the longest prefix with what was typed (typo help, not fuzzy magic).
  let best = 0;
  for (const n of names) { let k = 0; while (k < n.length && n[k] === name[k]) k++; best = Math.max(best, k); }
  const near = best >= 4 ? names.filter((n) => n.startsWith(name.slice(0, best))).slice(0, 6) : [];
  return {
    file: name,
    columnName: 'limits',
    message: `limits: found '${basename(name)}', expected a limit-set file (.yaml/.json) or a shipped profile name`
      + (near.length ? ` such as ${near.join(', ')}` : '') + ' (`spherecov limits` lists them)',
  };
}
