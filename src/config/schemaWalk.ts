import type { z } from 'zod';

/**
 * Reads a zod schema's structure along a data path: which keys a mapping may hold there and the
 * schema of one child. Used for the naming convention (renaming deprecated keys) and for naming
 * the closest known key of an unknown one. Wrappers (optional, default, nullable, pipe …) are
 * looked through; a discriminated union is resolved by the data's discriminator value.
 */
type Def = { type: string; [k: string]: unknown };
const defOf = (s: z.ZodType): Def => (s as unknown as { _zod: { def: Def } })._zod.def;

/** The schema under wrappers (the input side of a pipe or transform). */
export function unwrap(s: z.ZodType): z.ZodType {
  for (let i = 0; i < 50; i++) {
    const d = defOf(s);
    if (d.innerType) s = d.innerType as z.ZodType;
    else if (d.type === 'pipe') s = d.in as z.ZodType;
    else if (d.type === 'lazy') s = (d.getter as () => z.ZodType)();
    else return s;
  }
  return s;
}

function literalOf(s: z.ZodType | undefined): unknown[] | null {
  if (!s) return null;
  const d = defOf(unwrap(s));
  return d.type === 'literal' ? (d.values as unknown[]) : null;
}

/** The object shapes a value at this schema may take (one, or a union's candidates). */
function shapes(s: z.ZodType, value: unknown): Record<string, z.ZodType>[] {
  const d = defOf(unwrap(s));
  if (d.type === 'object') return [d.shape as Record<string, z.ZodType>];
  if (d.type !== 'union') return [];
  const options = (d.options as z.ZodType[]).flatMap((o) => shapes(o, value));
  const disc = d.discriminator as string | undefined;
  if (disc && typeof value === 'object' && value !== null) {
    const v = (value as Record<string, unknown>)[disc];
    const picked = options.filter((sh) => literalOf(sh[disc])?.includes(v));
    if (picked.length) return picked;
  }
  return options;
}

/** The keys a mapping may hold at this schema, or null when it is not a mapping there. */
export function knownKeys(s: z.ZodType, value: unknown): string[] | null {
  const all = shapes(s, value);
  return all.length ? [...new Set(all.flatMap((sh) => Object.keys(sh)))] : null;
}

/** The schema of one child (a mapping key or a list index), or null. */
export function childSchema(s: z.ZodType, key: string | number, value: unknown): z.ZodType | null {
  const u = unwrap(s);
  const d = defOf(u);
  if (typeof key === 'number') {
    if (d.type === 'array') return d.element as z.ZodType;
    if (d.type === 'tuple') return ((d.items as z.ZodType[])[key] ?? null);
    return null;
  }
  if (d.type === 'record') return d.valueType as z.ZodType;
  for (const sh of shapes(u, value)) if (sh[key]) return sh[key];
  return null;
}
