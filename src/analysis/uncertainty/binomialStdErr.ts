/**
 * Standard error of a Monte-Carlo probability estimate p̂ = k/N (binomial sampling):
 * se = √(p̂(1 − p̂)/N) (Eq. B1, the normal approximation of the binomial; any statistics
 * textbook). Boundary rule: p̂ = 0 or 1 gives 0 — read it with the resolution 1/N beside it.
 * Cost O(1).
 * @throws RangeError when N < 1.
 * @example binomialStdErr(0.5, 1000) // 0.0158…
 */
export function binomialStdErr(p: number, draws: number): number {
  if (!(draws >= 1)) throw new RangeError(`binomialStdErr: ${draws} draws`);
  return Math.sqrt((p * (1 - p)) / draws); // Eq. (B1)
}
