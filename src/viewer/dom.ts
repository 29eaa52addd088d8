/// <reference lib="dom" />
/** A small element builder: text always goes in as text (no HTML from data). */
export function el<K extends keyof HTMLElementTagNameMap>(
  tag: K,
  attrs: Record<string, string | number | boolean | undefined> = {},
  ...children: (Node | string | null | undefined)[]
): HTMLElementTagNameMap[K] {
  const e = document.createElement(tag);
  for (const [k, v] of Object.entries(attrs)) {
    if (v === undefined || v === false) continue;
    if (k === 'class') e.className = String(v);
    else e.setAttribute(k, v === true ? '' : String(v));
  }
  for (const c of children) if (c !== null && c !== undefined) e.append(typeof c === 'string' ? document.createTextNode(c) : c);
  return e;
}

/** Fixed decimals, '—' for null or non-finite. */
export function num(v: number | null | undefined, digits = 2): string {
  if (v === null || v === undefined || !Number.isFinite(v)) return '—';
  const s = v.toFixed(digits);
  return /^-0(\.0+)?$/.test(s) ? s.slice(1) : s;
}

export function pctText(f: number | null | undefined, digits = 1): string {
  return f === null || f === undefined || !Number.isFinite(f) ? '—' : `${(100 * f).toFixed(digits)} %`;
}

export function freqText(hz: number | null): string {
  return hz === null ? '—' : `${+(hz / 1e9).toFixed(4)} GHz`;
}
