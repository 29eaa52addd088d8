import type { CheckKind, Quantity } from '../types.js';
import type { CheckDraft } from './limitSet.js';
import { isLowerBetter, quantityLabelInText, quantityUnit } from '../quantity.js';

/**
 * Which side of the limit is good for a check kind on a quantity.
 *
 * 'lower' bound: value ≥ limit passes; 'upper' bound: value ≤ limit passes. The "at least as
 * good as" kinds (min-peak, percentile, min-beam-peak) flip for eis, where smaller is better;
 * min-coverage judges an efficiency (always a lower bound); max-peak and max-trp are upper
 * bounds on power.
 *
 * Cost O(1).
 * @example checkBound('min-peak', 'eis') // 'upper' (best EIS ≤ REFSENS)
 */
export function checkBound(kind: CheckKind, quantity: Quantity): 'lower' | 'upper' {
  if (kind === 'max-peak' || kind === 'max-trp') return 'upper';
  if (kind === 'min-coverage') return 'lower';
  return isLowerBetter(quantity) ? 'upper' : 'lower';
}

/**
 * Check kinds that mean something for a quantity: a maximum EIRP or TRP has no EIS meaning,
 * and TRP of a gain pattern is a mean gain (not a power), so max-trp is eirp only.
 */
export function kindAllowed(kind: CheckKind, quantity: Quantity): boolean {
  if (kind === 'max-trp') return quantity === 'eirp';
  if (kind === 'max-peak') return !isLowerBetter(quantity);
  return true;
}


/** Name a check gets when the file gives none (stable: used as a metric key in build stats). */
export function defaultCheckName(check: CheckDraft, quantity: Quantity): string {
  const q = quantityLabelInText(quantity);
  switch (check.kind) {
    case 'min-peak': return `peak ${q}`;
    case 'max-peak': return `max ${q}`;
    case 'max-trp': return 'max TRP';
    case 'min-beam-peak': return `beam peak ${q}`;
    case 'percentile': return `${q} at ${check.levelPct} %`;
    case 'min-coverage':
      return `coverage at ${check.threshold} ${quantityUnit(quantity)}`;
  }
}
