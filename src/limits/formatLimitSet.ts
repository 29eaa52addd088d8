import type { LimitCheck, LimitSet } from './limitSet.js';
import { kindDef, type CheckOf } from './checkKinds.js';
import { quantityUnit } from '../quantity.js';

/** The rule of one check in words, e.g. "value at the 50 % CDF level ≥ 11.5 dBm" (registry: `describe`). */
export function describeCheck(c: LimitCheck, ls: Pick<LimitSet, 'quantity'>): string {
  return kindDef(c.kind).describe(c as CheckOf<typeof c.kind>, ls.quantity);
}

/**
 * Human-readable listing of a limit set (for `spherecov limits <name>`): header facts, one
 * numbered line per check with its rule and source, and the caution that limits copied from a
 * standard must be verified and that results are engineering data, not conformance.
 *
 * Cost O(checks).
 * @example formatLimitSet(loadLimitSet('3gpp-fr2-pc3-n257').limitSet!).split('\n')[0] // '3gpp-fr2-pc3-n257'
 */
export function formatLimitSet(ls: LimitSet): string {
  const lines: string[] = [ls.name];
  if (ls.description) lines.push(...wrap(ls.description, 96).map((l) => `  ${l}`));
  lines.push(`  quantity: ${ls.quantity} (${quantityUnit(ls.quantity)})`);
  if (ls.band || ls.frequencyRangeMHz) {
    const range = ls.frequencyRangeMHz ? `${ls.frequencyRangeMHz[0]}–${ls.frequencyRangeMHz[1]} MHz` : '';
    lines.push(`  band: ${[ls.band, range].filter(Boolean).join(', ')}`);
  }
  lines.push(`  source: ${ls.source}`);
  if (ls.file) lines.push(`  file: ${ls.file}`);
  lines.push('', `checks (${ls.checks.length}):`);
  ls.checks.forEach((c, i) => {
    lines.push(`  ${i + 1}. ${c.name} [${c.kind}]`, `     ${describeCheck(c, ls)}`);
    if (c.source) lines.push(`     source: ${c.source}`);
  });
  if (ls.checks.length === 0) lines.push('  (none: every unit gets verdict "none")');
  lines.push('',
    'Test tolerance is 0 dB unless the limit set states one; set your own agreed values.',
    'Limits copied from a standard must be verified against the current release.',
    'Results are engineering data, not a regulatory conformance or RF-exposure assessment;',
    'defer to accredited labs and local rules.');
  return lines.join('\n') + '\n';
}

/** Greedy word wrap for terminal listings. */
function wrap(text: string, width: number): string[] {
  const out: string[] = [];
  let line = '';
  for (const w of text.split(/\s+/)) {
    if (line && line.length + 1 + w.length > width) { out.push(line); line = w; } else line = line ? `${line} ${w}` : w;
  }
  if (line) out.push(line);
  return out;
}
