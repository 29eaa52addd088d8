import type { LimitSet } from './limitSet.js';
import { kindDef, type CheckOf } from './checkKinds.js';

/**
 * What the batch must compute so every check can be judged: the union of each check kind's
 * needs (registry, checkKinds.ts) — CDF levels, absolute coverage thresholds (as written and
 * relaxed by the test tolerance) and thresholds relative to the peak — sorted, unique.
 *
 * Cost O(checks log checks).
 * @example metricNeeds(ls) // { percentilesPct: [50], thresholds: [9, 10], relativeDb: [] }
 */
export function metricNeeds(ls: LimitSet): { percentilesPct: number[]; thresholds: number[]; relativeDb: number[] } {
  const levels = new Set<number>();
  const thresholds = new Set<number>();
  const relative = new Set<number>();
  for (const c of ls.checks) {
    const n = kindDef(c.kind).needs(c as CheckOf<typeof c.kind>, ls.quantity);
    for (const x of n.percentilesPct ?? []) levels.add(x);
    for (const x of n.thresholds ?? []) thresholds.add(x);
    for (const x of n.relativeDb ?? []) relative.add(x);
  }
  const asc = (a: number, b: number): number => a - b;
  return { percentilesPct: [...levels].sort(asc), thresholds: [...thresholds].sort(asc), relativeDb: [...relative].sort(asc) };
}

/** Sorted, de-duplicated union of number lists. */
export function unionSorted(...lists: (number[] | undefined)[]): number[] {
  const s = new Set<number>();
  for (const l of lists) for (const x of l ?? []) s.add(x);
  return [...s].sort((a, b) => a - b);
}

/**
 * The levels and thresholds a run computes: what was asked for (options, job file, library
 * input) united with what the limit set implies (metricNeeds). The one place both the CLI batch
 * and the library entry point take these lists from.
 * @example metricLists({ percentilesPct: [50] }, null) // { percentilesPct: [50], thresholds: [], relativeDb: [] }
 */
export function metricLists(asked: { percentilesPct?: number[]; thresholds?: number[]; relativeDb?: number[] }, ls: LimitSet | null):
  { percentilesPct: number[]; thresholds: number[]; relativeDb: number[] } {
  const needs = ls ? metricNeeds(ls) : { percentilesPct: [], thresholds: [], relativeDb: [] };
  return {
    percentilesPct: unionSorted(asked.percentilesPct, needs.percentilesPct),
    thresholds: unionSorted(asked.thresholds, needs.thresholds),
    relativeDb: unionSorted(asked.relativeDb, needs.relativeDb),
  };
}
