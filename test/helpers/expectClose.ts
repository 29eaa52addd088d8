import { expect } from 'vitest';

/**
 * The one closeness assertion of the suite: |actual − expected| ≤ tol, with the reason for the
 * tolerance in the failure message. Every call states why its tolerance is what it is.
 */
export function expectClose(actual: number, expected: number, tol: number, why: string): void {
  const diff = Math.abs(actual - expected);
  expect(diff <= tol, `${why}: |${actual} − ${expected}| = ${diff} > ${tol}`).toBe(true);
}

/** Relative version: |actual − expected| ≤ relTol·|expected|. */
export function expectRelClose(actual: number, expected: number, relTol: number, why: string): void {
  expectClose(actual, expected, relTol * Math.abs(expected), why);
}
