/**
 * One Unicode form (NFC) for unit and beam names before anything groups by them: 'é' typed as one
 * code point or as e + combining accent is one unit (two chamber PCs, two keyboards). Analyze
 * (src/batch/unitTask.ts) and inspect both apply it to what the readers return, so both show the
 * same units.
 */
import type { RawBeam } from './types.js';

/**
 * Rewrite each beam's unit and beam names in NFC, in place, and note every unit's spellings as
 * written (results.json `unitAsWritten`) in `spellings` when given. Cost O(beams).
 * @example nfcIdentity(beams, spellings) // 'Cafe\u0301-01' → 'Caf\u00e9-01', spellings: both
 */
export function nfcIdentity(beams: RawBeam[], spellings?: Map<string, Set<string>>): void {
  for (const b of beams) {
    const unit = b.unit.normalize('NFC');
    spellings?.set(unit, (spellings.get(unit) ?? new Set()).add(b.unit));
    b.unit = unit;
    b.beam = b.beam.normalize('NFC');
  }
}
