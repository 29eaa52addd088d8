/**
 * A small seeded pseudo-random source for the measurement model: mulberry32 for uniforms and
 * the Box–Muller transform for standard normals. Same seed, same sequence, on every platform.
 *
 * Formula: mulberry32 is a 32-bit state, add-0x6D2B79F5-then-mix generator (public-domain
 * construction); Box–Muller: z = √(−2 ln u₁) · cos(2π u₂) (Box & Muller, Ann. Math. Statist.
 * 29 (1958), Eq. (1)).
 * Boundary rule: uniforms lie in [0, 1); u₁ = 0 is mapped to 2⁻³² so ln never sees 0.
 * Cost: O(1) per draw. Not cryptographic; for reproducible synthetic data only.
 * @example
 * const rng = createRng(7); rng.uniform(); // same value on every run
 */
export interface Rng {
  /** Uniform in [0, 1). */
  uniform(): number;
  /** Standard normal N(0, 1). */
  normal(): number;
}

export function createRng(seed: number): Rng {
  let state = seed >>> 0;
  const uniform = (): number => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  let spare: number | null = null;
  const normal = (): number => {
    if (spare !== null) {
      const z = spare;
      spare = null;
      return z;
    }
    const u1 = Math.max(uniform(), 2 ** -32);
    const u2 = uniform();
    const r = Math.sqrt(-2 * Math.log(u1));
    spare = r * Math.sin(2 * Math.PI * u2);
    return r * Math.cos(2 * Math.PI * u2); // Eq. (1)
  };
  return { uniform, normal };
}
