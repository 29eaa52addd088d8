import type { BuildConfidence, UnitResult } from '../../types.js';

type Cell = string | number | null;

/**
 * The summary.csv columns of "how sure is the verdict", present only when some unit of the run
 * carries a measurement uncertainty (a run without one keeps its columns unchanged):
 * decision_rule, statement (non-binary statement or pass/fail), probability_of_conformance (all
 * checks jointly) and its binomial standard error, and at the level the verdict reads (the first
 * percentile check's, else 50 %): that level, its max-over-noisy-beams bias (dB) and its grid
 * adequacy (±dB).
 * Cost O(units · checks).
 * @example confidenceColumns(units).header // ['decision_rule', 'statement', …] or []
 */
export function confidenceColumns(units: UnitResult[]): { header: string[]; cells: (u: UnitResult) => Cell[] } {
  if (!units.some((u) => u.confidence)) return { header: [], cells: () => [] };
  return {
    header: ['decision_rule', 'statement', 'probability_of_conformance', 'probability_std_err', 'reading_level_pct', 'reading_bias_db', 'reading_grid_adequacy_db'],
    cells: (u) => {
      const c = u.confidence;
      const level = u.checks.find((k) => k.kind === 'percentile')?.levelPct ?? 50;
      return [
        c?.decisionRule ?? null, c?.statement ?? null, c?.probabilityOfConformance ?? null, c?.probabilityStdErr ?? null, level,
        c?.percentiles.find((p) => p.levelPct === level)?.biasDb ?? null,
        u.gridAdequacy?.percentiles.find((p) => p.levelPct === level)?.adequacyDb ?? null,
      ];
    },
  };
}

/** Percent with one decimal. */
const pc = (p: number): string => `${(100 * p).toFixed(1)} %`;

/**
 * The console's "how sure" cell: the statement (non-binary rule) or the rule's pass/fail, and the
 * probability that every check is truly met with its standard error, e.g.
 * `conditional pass · P 71.2 % ± 1.4`. '—' without an uncertainty.
 */
export function howSureText(u: UnitResult): string {
  const c = u.confidence;
  if (!c) return '—';
  const p = c.probabilityOfConformance === null ? 'P —' : `P ${pc(c.probabilityOfConformance)} ± ${(100 * (c.probabilityStdErr ?? 0)).toFixed(1)}`;
  return `${c.statement ?? 'not judged'} · ${p}`;
}

/** The build line: expected conforming unit results beside the count of passes. */
export function expectedConformingText(b: BuildConfidence): string {
  return `With measurement uncertainty (${b.decisionRule}): ${b.passes} of ${b.judged} judged unit result(s) passed; expected truly conforming ${b.expectedConforming.toFixed(1)} ± ${b.expectedConformingStdErr.toFixed(1)} (sum of the probabilities of conformance).`;
}
