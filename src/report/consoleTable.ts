/**
 * The verdict table `analyze` prints on stdout (terminal or not): one row per unit and
 * frequency — analyzed or not — then the build's counts with their denominators, the first
 * error of every unit that could not be read, and the files written.
 */
import type { ResultsFile } from '../types.js';
import { fmt, fmtFrequency } from './format.js';
import { expectedConformingText, howSureText } from '../analysis/uncertainty/confidenceColumns.js';
import { errorLocation, errorMessage, verdictWord, worstMarginText } from './unitStatus.js';

/** Plain-text table: columns padded to their widest cell (code points), two spaces apart. */
export function textTable(head: string[], rows: string[][]): string {
  const len = (s: string) => [...s].length;
  const widths = head.map((h, i) => Math.max(len(h), ...rows.map((r) => len(r[i] ?? ''))));
  const line = (r: string[]) => r.map((c, i) => (i === r.length - 1 ? c : c + ' '.repeat(widths[i] - len(c)))).join('  ').trimEnd();
  return [line(head), widths.map((w) => '-'.repeat(w)).join('  '), ...rows.map(line)].join('\n') + '\n';
}

/** `2 of 3` with the share in percent when the denominator is not 0. */
function ofText(n: number, d: number): string {
  return d === 0 ? `${n} of 0` : `${n} of ${d} (${fmt((100 * n) / d, 1)} %)`;
}

/**
 * The console summary of a finished run.
 * @param written files written into the output folder, in the order they should be named
 * @param outDir the output folder as the user typed it
 */
export function consoleTable(results: Pick<ResultsFile, 'units' | 'unitsNotAnalyzed' | 'build' | 'errors'>, written: string[], outDir: string): string {
  type Row = { unit: string; f: number | null; cells: string[] };
  const sure = results.units.some((u) => u.confidence); // issue 17: a "how sure" column only with an uncertainty
  const rows: Row[] = results.units.map((u) => ({
    unit: u.unit,
    f: u.frequencyHz,
    cells: [
      u.unit,
      u.frequencyHz === null ? '—' : fmtFrequency(u.frequencyHz),
      verdictWord(u.verdict),
      u.worstCheck?.name ?? '—',
      worstMarginText(u),
      u.grid.fullSphere ? 'full' : `partial ${fmt((100 * u.solidAngleSr) / (4 * Math.PI), 1)} %`,
      String(u.warnings.length),
      ...(sure ? [howSureText(u)] : []),
    ],
  }));
  for (const e of results.unitsNotAnalyzed) {
    rows.push({
      unit: e.unit,
      f: e.frequencyHz,
      cells: [e.unit, e.frequencyHz === null ? '—' : fmtFrequency(e.frequencyHz), 'ERROR', `unreadable: ${errorLocation(e.error)}`, '—', '—', '—', ...(sure ? ['—'] : [])],
    });
  }
  rows.sort((a, b) => (a.unit < b.unit ? -1 : a.unit > b.unit ? 1 : (a.f ?? -1) - (b.f ?? -1)));
  let text = textTable(['unit', 'frequency', 'verdict', 'worst check', 'margin', 'sphere', 'warnings', ...(sure ? ['how sure'] : [])], rows.map((r) => r.cells));
  const b = results.build;
  if (b) {
    const judged = b.passed + b.failed;
    text += `\n${b.unitsInBuild} unit(s) in the build: ${b.passed} passed, ${b.failed} failed, ${b.notJudged} not judged, ${b.errored} could not be read or analyzed.\n`;
    text += `Yield: ${ofText(b.passed, b.unitsInBuild)} units in the build passed; ${ofText(b.passed, judged)} judged units passed.\n`;
    if (b.confidence) text += `${expectedConformingText(b.confidence)}\n`;
  }
  if (results.unitsNotAnalyzed.length > 0) {
    text += '\n';
    for (const e of results.unitsNotAnalyzed) {
      const more = e.errorCount > 1 ? ` (${e.errorCount} errors in this unit's files)` : '';
      text += `${e.unit}${e.frequencyHz === null ? '' : ` at ${fmtFrequency(e.frequencyHz)}`} not analyzed: ${errorLocation(e.error)}: ${errorMessage(e.error)}${more}\n`;
    }
  } else if (results.errors.length > 0) {
    text += `\n${results.errors.length} input error(s) (listed on stderr).\n`;
  }
  if (written.length > 0) text += `\nWrote ${written.join(', ')} in ${outDir.replace(/[\\/]+$/, '')}/\n`;
  return text;
}
