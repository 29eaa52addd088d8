import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';

const require = createRequire(import.meta.url);

let cache: { regular: Buffer; bold: Buffer } | null = null;

/**
 * DejaVu Sans regular and bold (open licence, from the dejavu-fonts-ttf package), embedded in every
 * PDF so θ, φ, Ω, σ, ≥ and π render. Read once per process; resolved through the module
 * resolver so it works from src/ and dist/.
 */
export function reportFonts(): { regular: Buffer; bold: Buffer } {
  cache ??= {
    regular: readFileSync(require.resolve('dejavu-fonts-ttf/ttf/DejaVuSans.ttf')),
    bold: readFileSync(require.resolve('dejavu-fonts-ttf/ttf/DejaVuSans-Bold.ttf')),
  };
  return cache;
}
