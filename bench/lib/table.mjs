// The benchmark's one result table: stage | metric | value | target | status.

/**
 * A table row. `value` is a number (formatted with `digits`) or null (stage not available /
 * failed: status 'n/a' with `note`). `target` is { op: '<=' | '<' | '>=', limit } or null for an
 * informational line. Status: 'ok', 'NOT OK', 'n/a' or '' (information only).
 */
export function row(stage, metric, value, { target = null, digits = 3, unit = '', note = '' } = {}) {
  let status = '';
  if (value === null || value === undefined || Number.isNaN(value)) status = 'n/a';
  else if (target) status = meets(value, target) ? 'ok' : 'NOT OK';
  return {
    stage,
    metric,
    value: value === null || value === undefined ? '—' : fmt(value, digits) + (unit ? ` ${unit}` : ''),
    target: target ? `${target.op} ${target.limit}${unit && target.unitShown !== false ? ` ${unit}` : ''}` : '',
    status,
    note: value === null || value === undefined ? note || 'not available' : note,
  };
}

/** Does `value` satisfy `target`? */
export function meets(value, { op, limit }) {
  if (op === '<=') return value <= limit;
  if (op === '<') return value < limit;
  if (op === '>=') return value >= limit;
  throw new Error(`unknown target operator ${op}`);
}

/** Engineering-friendly number: `digits` decimals below 100, at most one below 1e4, grouped above. */
export function fmt(x, digits = 3) {
  if (!Number.isFinite(x)) return String(x);
  const a = Math.abs(x);
  if (a >= 1e4) return Math.round(x).toLocaleString('en-US');
  if (a >= 100) return x.toFixed(Math.min(digits, 1));
  return x.toFixed(digits);
}

/** Render rows as an aligned plain-text table, then one "TARGET MISSED" line per miss. */
export function renderTable(rows) {
  const head = { stage: 'stage', metric: 'metric', value: 'value', target: 'target', status: 'status' };
  const cols = ['stage', 'metric', 'value', 'target', 'status'];
  const all = [head, ...rows];
  const w = Object.fromEntries(cols.map((c) => [c, Math.max(...all.map((r) => String(r[c]).length))]));
  const line = (r) => cols.map((c) => String(r[c]).padEnd(w[c])).join('  ').trimEnd();
  const sep = cols.map((c) => '-'.repeat(w[c])).join('  ');
  const out = [line(head), sep, ...rows.map(line)];
  const missed = rows.filter((r) => r.status === 'NOT OK');
  if (missed.length) {
    out.push('');
    for (const r of missed) out.push(`TARGET MISSED: ${r.stage} / ${r.metric}: ${r.value} (target ${r.target})${r.note ? ` — ${r.note}` : ''}`);
  }
  const na = rows.filter((r) => r.status === 'n/a');
  if (na.length) {
    out.push('');
    for (const r of na) out.push(`not measured: ${r.stage} / ${r.metric}: ${r.note}`);
  }
  return out.join('\n');
}
