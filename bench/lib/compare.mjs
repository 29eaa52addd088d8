// Cross-check of spherecov's numbers against the pandas peer on the same file.
// The peer (/work/shared/bench/peer.py) uses the same definitions, computed independently with
// numpy/pandas. Known, expected differences:
// - poles: the peer keeps every (θ = 0, φ) sample as its own point, each weighted with 1/nφ of
//   the polar cap; spherecov merges a pole's samples into one direction (DESIGN.md). The caps are
//   2π(1 − cos(Δθ/2)) each, 1.9e-5 of 4π at 1° — the bound on coverage differences; a percentile
//   may move by one 0.01 dB step when its CDF crossing lies at a pole sample.
// - TRP: the same Σ w·10^(v/10) / 4π; a power-average merge of the pole samples leaves it
//   unchanged, so only summation order (compensated vs numpy pairwise) separates them.

/** Agreement tolerances, with the reason for each. */
export const TOLERANCE = {
  percentileDb: 0.01, // one quantization step of the 2-decimal export
  coverage: 1e-4, // > 2 polar caps at 1° (3.9e-5 of 4π) with margin
  trpDb: 1e-3, // pole merge rule + summation order; 1e-3 dB is far below any test tolerance
  solidAngleSr: 1e-9,
};

const num = (x) => (typeof x === 'number' && Number.isFinite(x) ? x : null);

/**
 * Compare the peer's JSON with one results.json unit. Returns rows
 * { what, peer, spherecov, diff, tol, agree } (agree null when a side is missing).
 */
export function comparePeer(peer, unit) {
  const rows = [];
  const add = (what, p, s, tol) => {
    p = num(p);
    s = num(s);
    const diff = p !== null && s !== null ? s - p : null;
    rows.push({ what, peer: p, spherecov: s, diff, tol, agree: diff === null ? null : Math.abs(diff) <= tol });
  };
  add('solid angle, sr', peer.solidAngleSr, unit.solidAngleSr, TOLERANCE.solidAngleSr);
  add('TSP peak, dBm', peer.tspPeak?.value, unit.tsp?.peak?.value, TOLERANCE.percentileDb);
  for (const [lvl, v] of Object.entries(peer.percentiles ?? {}).sort((a, b) => Number(a[0]) - Number(b[0]))) {
    const s = unit.tsp?.percentiles?.find((q) => q.levelPct === Number(lvl));
    add(`percentile ${lvl} %, dBm`, v, s?.value, TOLERANCE.percentileDb);
  }
  for (const [t, v] of Object.entries(peer.coverage ?? {}).sort((a, b) => Number(a[0]) - Number(b[0]))) {
    const s = unit.tsp?.coverage?.find((c) => c.threshold === Number(t));
    add(`coverage >= ${t} dBm`, v, s?.efficiency, TOLERANCE.coverage);
  }
  const trpDiffs = [];
  let missing = 0;
  for (const [id, v] of Object.entries(peer.trpDbm ?? {})) {
    const b = unit.beams?.find((x) => String(x.id) === id);
    if (!b || num(b.trpDbm) === null) missing++;
    else trpDiffs.push(b.trpDbm - v);
  }
  const worst = trpDiffs.length ? trpDiffs.reduce((a, d) => (Math.abs(d) > Math.abs(a) ? d : a), 0) : null;
  rows.push({
    what: `TRP, worst of ${trpDiffs.length} beams${missing ? ` (${missing} missing)` : ''}, dB`,
    peer: null,
    spherecov: null,
    diff: worst,
    tol: TOLERANCE.trpDb,
    agree: worst === null ? null : Math.abs(worst) <= TOLERANCE.trpDb && missing === 0,
  });
  return rows;
}

/** Plain-text rendering of comparePeer's rows. */
export function renderComparison(rows, peerPoints, ourPoints) {
  const f = (x, d = 4) => (x === null ? '—' : x.toFixed(d));
  const out = [`cross-check against the pandas peer (peer: ${peerPoints} points, spherecov: ${ourPoints ?? '?'} points after pole merge)`];
  out.push(`${'quantity'.padEnd(34)} ${'peer'.padStart(12)} ${'spherecov'.padStart(12)} ${'diff'.padStart(12)}  agreement`);
  for (const r of rows) {
    const verdict = r.agree === null ? 'n/a' : r.agree ? `agrees (|diff| <= ${r.tol})` : `DIFFERS (|diff| > ${r.tol})`;
    const digits = r.what.startsWith('coverage') ? 7 : r.what.startsWith('TRP') ? 8 : 4;
    out.push(`${r.what.padEnd(34)} ${f(r.peer, digits).padStart(12)} ${f(r.spherecov, digits).padStart(12)} ${(r.diff === null ? '—' : r.diff.toExponential(2)).padStart(12)}  ${verdict}`);
  }
  return out.join('\n');
}
