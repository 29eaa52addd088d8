/**
 * File-name safety for names that come from input files (unit, beam, frequency).
 *
 * Unit names are kept verbatim in results.json; only the names of files written under `--out`
 * go through here, so nothing a file says can escape the output folder or clash with a device
 * name of the operating system.
 */

/** Windows device names: a file called `con.pdf` cannot be opened there. */
const RESERVED = /^(con|prn|aux|nul|com[0-9]|lpt[0-9]|conin\$|conout\$)$/i;

/** Our own output stems: a unit called "summary" must not overwrite summary.pdf. */
const OWN_STEMS = new Set(['summary', 'results', 'build-stats']);

const MAX_STEM = 80;

/**
 * Turn an arbitrary name into a safe file stem: letters, digits, `.`, `_`, `-` only; no path
 * separators, no leading dot or dash, no `..`, no reserved device names, at most 80 characters.
 * @example sanitizeStem('../../etc/passwd') === 'etc_passwd'
 */
export function sanitizeStem(name: string): string {
  let s = name.normalize('NFKD').replace(/[\u0300-\u036f]/g, '').replace(/[^A-Za-z0-9._-]+/g, '_');
  s = s.replace(/\.{2,}/g, '_').replace(/_{2,}/g, '_');
  s = s.replace(/^[._-]+/, '').replace(/[._\s]+$/, '');
  if (s.length > MAX_STEM) s = s.slice(0, MAX_STEM).replace(/[._]+$/, '');
  if (s === '') s = 'unit';
  const base = s.split('.')[0] ?? s;
  if (RESERVED.test(base) || OWN_STEMS.has(s.toLowerCase())) s = `unit_${s}`;
  return s;
}

/** `28000000000` → `28GHz`, `28500000000` → `28.5GHz`, 2.45e9 → `2.45GHz`, sub-GHz in MHz. */
export function frequencyToken(frequencyHz: number): string {
  if (frequencyHz >= 1e9) return `${+(frequencyHz / 1e9).toFixed(6)}GHz`;
  if (frequencyHz >= 1e6) return `${+(frequencyHz / 1e6).toFixed(6)}MHz`;
  return `${+frequencyHz.toFixed(3)}Hz`;
}

/**
 * Assign unique, case-insensitively distinct stems to a list of keys in the given order
 * (callers pass them sorted, so the assignment is deterministic): a clash gets `-2`, `-3`, ….
 */
export function uniqueStems(names: string[]): string[] {
  const taken = new Set<string>();
  return names.map((n) => {
    const stem = sanitizeStem(n);
    let candidate = stem;
    for (let k = 2; taken.has(candidate.toLowerCase()); k++) candidate = `${stem}-${k}`;
    taken.add(candidate.toLowerCase());
    return candidate;
  });
}
