import type { CheckKind, Quantity } from '../types.js';
import type { CheckDraft } from './limitSet.js';
import { kindDef, type DraftOf } from './checkKinds.js';

/**
 * Which side of the limit is good for a check kind on a quantity (owned by the check-kind
 * registry, checkKinds.ts): 'lower' bound: value ≥ limit passes; 'upper' bound: value ≤ limit.
 * Cost O(1).
 * @example checkBound('min-peak', 'eis') // 'upper' (best EIS ≤ REFSENS)
 */
export function checkBound(kind: CheckKind, quantity: Quantity): 'lower' | 'upper' {
  return kindDef(kind).bound(quantity);
}

/** Check kinds that mean something for a quantity (registry: `appliesTo`). */
export function kindAllowed(kind: CheckKind, quantity: Quantity): boolean {
  return kindDef(kind).appliesTo(quantity);
}

/** Name a check gets when the file gives none (stable: used as a metric key in build stats). */
export function defaultCheckName(check: CheckDraft, quantity: Quantity): string {
  return kindDef(check.kind).defaultName(check as DraftOf<typeof check.kind>, quantity);
}
