import type { IdentitySource, JobSpec } from './types.js';
import { identityCapture } from './identityPattern.js';

export interface PathIdentity {
  unit: string;
  beam: string;
  frequencyHz: number | null;
  /** A `tx` / `rx` token in the file stem (transmit or receive export of the unit), else null. */
  link: 'tx' | 'rx' | null;
  sources: { unit: IdentitySource; beam: IdentitySource; frequency: IdentitySource };
}

const SEP = '[_\\-\\s.]';
const BEAM_RE = new RegExp(`(^|${SEP})(beam[_-]?(\\d+)|b(\\d+))(?=$|${SEP})`, 'i');
const FREQ_RE = new RegExp(`(^|${SEP})(\\d+(?:[.p]\\d+)?)\\s?ghz(?=$|${SEP})`, 'i');
const LINK_RE = new RegExp(`(^|${SEP})(tx|rx)(?=$|${SEP})`, 'i');

/** First capture group (or the whole match) of a job-file identity pattern (linear-time RE2 engine). */
function capture(pattern: string | undefined, relPath: string): string | null {
  if (!pattern) return null;
  return identityCapture(pattern, relPath);
}

/**
 * Identity of a file from its path (CONTRACT.md "Input folder"): unit = first subfolder below
 * the input root, else the file stem without beam, frequency and tx/rx tokens (so `X_tx.csv`
 * analyzed on its own is unit X, as it is inside a folder X/) — and when nothing is
 * left of the stem (`beam_3_28GHz.csv` directly in the folder analyzed), the name of that
 * folder (`rootName`), so one unit's folder analyzed on its own is still one unit; beam = a beam<N>,
 * beam_<N>, beam-<N> or b<N> token, else the stem; frequency = a <number>GHz token, else none.
 * Job-file patterns (group 1, frequency in GHz) take precedence over these rules.
 * @example pathIdentity('PX-01/PX-01_beam_5_28GHz.csv') // unit 'PX-01', beam '5', 28e9 Hz
 */
export function pathIdentity(relPath: string, job?: JobSpec, rootName?: string): PathIdentity {
  const parts = relPath.split('/');
  const base = parts[parts.length - 1];
  const stem = base.replace(/\.[^.]*$/, '');
  const beamM = BEAM_RE.exec(stem);
  const freqM = FREQ_RE.exec(stem);
  const linkM = LINK_RE.exec(stem);
  let rest = stem;
  for (const m of [beamM, freqM, linkM]) if (m) rest = rest.replace(m[0].slice(m[1].length), ' ');
  rest = rest.replace(/^[_\-\s.]+|[_\-\s.]+$/g, '').replace(/([_\-.])[\s_\-.]+/g, '$1').replace(/\s+/g, '_');

  const sources: PathIdentity['sources'] = { unit: 'file-name', beam: 'file-name', frequency: 'none' };
  const fromFolder = parts.length > 1 || (rest === '' && !!rootName);
  let unit = parts.length > 1 ? parts[0] : rest || rootName || stem;
  if (fromFolder) sources.unit = 'folder';
  let beam = beamM ? (beamM[3] ?? beamM[4]) : stem;
  let frequencyHz = freqM ? Number(freqM[2].replace('p', '.')) * 1e9 : null;
  if (freqM) sources.frequency = 'file-name';

  const ju = capture(job?.identity?.unit, relPath);
  if (ju !== null) [unit, sources.unit] = [ju, 'job'];
  const jb = capture(job?.identity?.beam, relPath);
  if (jb !== null) [beam, sources.beam] = [jb, 'job'];
  const jf = capture(job?.identity?.frequencyGhz, relPath);
  if (jf !== null && Number.isFinite(Number(jf))) [frequencyHz, sources.frequency] = [Number(jf) * 1e9, 'job'];
  return { unit, beam, frequencyHz, link: linkM ? (linkM[2].toLowerCase() as 'tx' | 'rx') : null, sources };
}
