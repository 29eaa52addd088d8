/// <reference lib="dom" />
/// <reference lib="dom.iterable" />
/**
 * viewer.html's page script (bundled into the page by src/report/viewerHtml.ts): units table,
 * map and sphere with a pointer read-out, CDF and coverage curve, beam toggles that recompute
 * with the tool's own functions, unit-to-unit and unit-to-reference difference maps.
 */
import type { Measurement, UnitResult } from '../types.js';
import type { ViewerBuild, ViewerUnit } from './viewerData.js';
import { unpackMeasurement } from './unpack.js';
import { beamsAt, recompute, type Computed } from './compute.js';
import { el, freqText, num, pctText } from './dom.js';
import { beamColors, beamCss, cssColorAt, diffScale, pointColors, valueScaleOf, type Scale } from './colors.js';
import { MapView } from './mapView.js';
import { Plot } from './plots.js';
import { SphereView, webglAvailable } from './sphere3d.js';
import { nearestGridPoint, type NearestLookup } from '../report/nearestGridPoint.js';
import { cdfCurve } from '../report/cdfCurve.js';
import { weightedCdf } from '../coverage/weightedCdf.js';
import { percentile } from '../coverage/percentile.js';
import { coverageEfficiency } from '../coverage/coverageEfficiency.js';
import { tspDifference } from '../analysis/tspDifference.js';
import { totalScanPattern } from '../coverage/totalScanPattern.js';

type Dir = { thetaDeg: number; phiDeg: number };
type MapMode = 'tsp' | 'best' | 'diff';

interface Loaded { m: Measurement; lookup: NearestLookup; fullTsp: Float64Array }

const data = JSON.parse((document.getElementById('spherecov-data') as HTMLElement).textContent as string) as ViewerBuild;
const cache = new Map<string, Promise<Loaded>>();
const state = {
  unit: 0,
  enabled: [] as boolean[],
  computed: null as Computed | null,
  loaded: null as Loaded | null,
  mode: 'tsp' as MapMode,
  compareKey: '' as string,
  diff: null as Float64Array | null,
  sortKey: 'unit' as string,
  sortAsc: true,
};

function load(u: ViewerUnit): Promise<Loaded> {
  let p = cache.get(u.key);
  if (!p) {
    p = unpackMeasurement(u).then((m) => ({ m, lookup: nearestGridPoint(m.grid), fullTsp: totalScanPattern(m.beams.map((b) => b.values), m.quantity).values }));
    cache.set(u.key, p);
  }
  return p;
}

const unitLabel = (u: ViewerUnit): string => (u.frequencyHz === null ? u.unit : `${u.unit} @ ${freqText(u.frequencyHz)}`);
const verdictText = (v: UnitResult['verdict']): string => (v === 'pass' ? 'PASS' : v === 'fail' ? 'FAIL' : 'NOT JUDGED');
const marginOf = (r: UnitResult): number | null => r.worstCheck ? (r.worstCheck.marginDb ?? r.worstCheck.margin) : null;
const removalPct = (r: UnitResult): number | null => r.tsp.percentiles.find((p) => p.levelPct === data.removalLevelPct)?.value ?? null;

// ---------- layout ----------
const app = document.getElementById('app') as HTMLElement;
const header = el('header', {},
  el('h1', {}, 'spherecov build viewer'),
  el('p', { class: 'meta' }, `Build '${data.input}', ${data.units.length} unit result(s), analyzed ${data.generatedAt} by spherecov ${data.tool.version}. `,
    `Limit set: ${data.limitSet ? data.limitSet.name : 'none (not judged)'}. `,
    data.reference ? `Reference unit: ${data.reference}. ` : '',
    'Values are stored to 0.01 dB; recomputed figures match results.json within 0.005 dB.',
    data.units.some((u) => (u.result as { confidence?: unknown }).confidence)
      ? ' The page judges recomputed checks by the plain limits (shared risk); results.json\'s verdicts apply the run\'s decision rule and measurement uncertainty.'
      : ''),
);
const unitsTable = el('table', { class: 'units', 'data-testid': 'units-table' });
const unitTitle = el('h2', { id: 'unit-title' });
const verdictBox = el('p', { class: 'verdict', 'data-testid': 'verdict' });
const modeSelect = el('select', { 'aria-label': 'Map shows', 'data-testid': 'map-mode' },
  el('option', { value: 'tsp' }, 'total scan pattern'), el('option', { value: 'best' }, 'best beam'), el('option', { value: 'diff' }, 'difference to …'));
const compareSelect = el('select', { 'aria-label': 'Compare with', 'data-testid': 'compare' });
const mapCanvas = el('canvas', { class: 'map', tabindex: 0, 'aria-label': 'Equal-area map of the sphere; arrow keys move the cursor', 'data-testid': 'map' });
const colorBar = el('div', { class: 'colorbar', 'data-testid': 'colorbar' });
const sphereCanvas = el('canvas', { class: 'sphere', 'aria-label': 'Rotatable sphere; drag or arrow keys to turn, + and − to zoom, 0 to reset', 'data-testid': 'sphere' });
const sphereNote = el('p', { class: 'note' });
const readout = el('dl', { class: 'readout', 'data-testid': 'readout' });
const beamList = el('div', { class: 'beams', 'data-testid': 'beams' });
const checksTable = el('table', { class: 'checks', 'data-testid': 'checks' });
const pctTable = el('table', { class: 'pcts', 'data-testid': 'percentiles' });
const holesBox = el('div', { class: 'holes', 'data-testid': 'holes' });
const cdfCanvas = el('canvas', { class: 'plot', 'data-testid': 'cdf' });
const cdfOut = el('p', { class: 'plotout', 'data-testid': 'cdf-readout' });
const covCanvas = el('canvas', { class: 'plot', 'data-testid': 'coverage' });
const covOut = el('p', { class: 'plotout', 'data-testid': 'coverage-readout' });

app.append(
  header,
  el('section', { class: 'panel', id: 'units' }, el('h2', {}, 'Units'), el('p', { class: 'hint noprint' }, 'Click a column to sort; click a row (or Enter / arrow keys) to show the unit.'), unitsTable),
  el('section', { class: 'panel', id: 'unit' }, unitTitle, verdictBox,
    el('div', { class: 'views' },
      el('figure', { class: 'mapfig' },
        el('div', { class: 'controls noprint' }, el('label', {}, 'Map: ', modeSelect), ' ', el('label', {}, 'compare with: ', compareSelect)),
        mapCanvas, colorBar, el('figcaption', {}, 'Equal-area (Hammer) map, as in the PDF: area on the page is proportional to solid angle. Hatched: not measured.')),
      el('figure', { class: 'spherefig' }, sphereCanvas, sphereNote, el('figcaption', {}, 'The same pattern on the sphere (axes: x red, y green, z blue; θ from +z).')),
      el('aside', { class: 'readoutbox' }, el('h3', {}, 'Read-out'), readout)),
    el('div', { class: 'cols' },
      el('div', {}, el('h3', {}, 'Beams'), el('p', { class: 'hint noprint' }, 'Switch beams off to see the coverage without them: the total scan pattern, CDF, checks and holes are recomputed in the page with the tool\'s code.'),
        el('div', { class: 'noprint' }, el('button', { type: 'button', id: 'all-on', 'data-testid': 'all-on' }, 'all beams on')), beamList),
      el('div', {}, el('h3', {}, 'Checks'), checksTable, el('h3', {}, 'Percentiles'), pctTable, el('h3', {}, 'Coverage holes'), holesBox)),
    el('div', { class: 'cols' },
      el('figure', {}, el('h3', {}, 'CDF of the total scan pattern'), cdfCanvas, cdfOut),
      el('figure', {}, el('h3', {}, 'Coverage efficiency'), covCanvas, covOut))),
);

const mapView = new MapView(mapCanvas, (d) => showReadout(d, false));
let sphere: SphereView | null = null;
if (webglAvailable()) {
  sphere = new SphereView(sphereCanvas, (d) => showReadout(d, false));
} else {
  sphereCanvas.hidden = true;
  sphereNote.textContent = 'This browser offers no WebGL, so the 3D sphere is not shown; the map shows the same data.';
}
const cdfPlot = new Plot(cdfCanvas, cdfOut);
const covPlot = new Plot(covCanvas, covOut);

// ---------- units table ----------
interface Col { key: string; label: string; value: (u: ViewerUnit) => string | number | null; text: (u: ViewerUnit) => string }
const cols: Col[] = [
  { key: 'unit', label: 'unit', value: (u) => u.unit, text: (u) => u.unit },
  { key: 'freq', label: 'frequency', value: (u) => u.frequencyHz, text: (u) => freqText(u.frequencyHz) },
  { key: 'beams', label: 'beams', value: (u) => u.beamIds.length, text: (u) => String(u.beamIds.length) },
  { key: 'verdict', label: 'verdict', value: (u) => ({ fail: 0, none: 1, pass: 2 })[u.result.verdict], text: (u) => verdictText(u.result.verdict) },
  { key: 'worst', label: 'worst check', value: (u) => u.result.worstCheck?.name ?? null, text: (u) => u.result.worstCheck?.name ?? '—' },
  { key: 'margin', label: 'margin dB', value: (u) => marginOf(u.result), text: (u) => num(marginOf(u.result)) },
  { key: 'peak', label: 'peak', value: (u) => u.result.tsp.peak.value, text: (u) => `${num(u.result.tsp.peak.value)} ${u.valueUnit}` },
  { key: 'level', label: `${data.removalLevelPct} % level`, value: (u) => removalPct(u.result), text: (u) => num(removalPct(u.result)) },
];

function renderUnitsTable(): void {
  const order = data.units.map((_, i) => i);
  const col = cols.find((c) => c.key === state.sortKey) as Col;
  order.sort((a, b) => {
    const va = col.value(data.units[a]), vb = col.value(data.units[b]);
    const r = va === null ? (vb === null ? 0 : 1) : vb === null ? -1 : typeof va === 'number' && typeof vb === 'number' ? va - vb : String(va).localeCompare(String(vb));
    return (state.sortAsc || va === null || vb === null ? r : -r) || a - b;
  });
  const head = el('tr', {}, ...cols.map((c) => {
    const sorted = c.key === state.sortKey;
    const th = el('th', { scope: 'col', 'aria-sort': sorted ? (state.sortAsc ? 'ascending' : 'descending') : 'none' },
      el('button', { type: 'button', class: 'sort', 'data-sort': c.key }, c.label + (sorted ? (state.sortAsc ? ' ▲' : ' ▼') : '')));
    (th.firstChild as HTMLButtonElement).addEventListener('click', () => {
      state.sortAsc = state.sortKey === c.key ? !state.sortAsc : true;
      state.sortKey = c.key;
      renderUnitsTable();
    });
    return th;
  }));
  const body = order.map((i) => {
    const u = data.units[i];
    const tr = el('tr', { tabindex: 0, 'data-key': u.key, 'data-unit': u.unit, class: `${u.result.verdict}${i === state.unit ? ' chosen' : ''}`, 'aria-selected': i === state.unit ? 'true' : 'false' },
      ...cols.map((c) => el('td', { class: `c-${c.key}` }, c.text(u))));
    tr.addEventListener('click', () => void chooseUnit(i));
    tr.addEventListener('keydown', (e) => {
      if (e.key === 'Enter' || e.key === ' ') { e.preventDefault(); void chooseUnit(i); }
      else if (e.key === 'ArrowDown' || e.key === 'ArrowUp') {
        e.preventDefault();
        const sib = (e.key === 'ArrowDown' ? tr.nextElementSibling : tr.previousElementSibling) as HTMLElement | null;
        sib?.focus();
      }
    });
    return tr;
  });
  unitsTable.replaceChildren(el('thead', {}, head), el('tbody', {}, ...body));
}

// ---------- unit ----------
async function chooseUnit(i: number): Promise<void> {
  state.unit = i;
  const u = data.units[i];
  renderUnitsTable();
  unitTitle.textContent = `${unitLabel(u)} (${u.quantity.toUpperCase()}, ${u.valueUnit})`;
  const loaded = await load(u);
  if (state.unit !== i) return;
  state.loaded = loaded;
  state.enabled = u.beamIds.map(() => true);
  mapView.setGrid(loaded.m.grid, data.mapCenterPhiDeg);
  sphere?.setGrid(loaded.lookup);
  renderCompareOptions();
  renderBeamList();
  await update();
  document.body.dataset.ready = u.key;
}

function renderCompareOptions(): void {
  const u = data.units[state.unit];
  const opts: HTMLOptionElement[] = [el('option', { value: '' }, '(choose)')];
  const ref = referenceEntry(u);
  if (ref) opts.push(el('option', { value: `ref:${ref.key}` }, `reference unit ${ref.unit}`));
  data.units.forEach((o) => { if (o.key !== u.key && o.quantity === u.quantity) opts.push(el('option', { value: `unit:${o.key}` }, unitLabel(o))); });
  compareSelect.replaceChildren(...opts);
  if (![...compareSelect.options].some((o) => o.value === state.compareKey)) state.compareKey = '';
  compareSelect.value = state.compareKey;
}

/** The reference unit's entry at this unit's frequency (a unit of the build, or the golden unit's pattern). */
function referenceEntry(u: ViewerUnit): ViewerUnit | null {
  if (!data.reference) return null;
  const pool = data.referenceUnits.length ? data.referenceUnits : data.units.filter((o) => o.unit === data.reference && o.key !== u.key);
  return pool.find((o) => o.frequencyHz === u.frequencyHz && o.quantity === u.quantity) ?? null;
}

function renderBeamList(): void {
  const u = data.units[state.unit];
  const rows = u.beamIds.map((id, k) => {
    const rb = u.result.beams[k];
    const loss = rb?.removal?.percentileLossDb;
    const box = el('input', { type: 'checkbox', checked: state.enabled[k], 'data-beam': id, id: `beam-${k}` });
    box.addEventListener('change', () => { state.enabled[k] = box.checked; void update(); });
    return el('tr', {},
      el('td', {}, box),
      el('td', {}, el('span', { class: 'swatch', style: `background:${beamCss(k)}` }), el('label', { for: `beam-${k}` }, id)),
      el('td', { class: 'num' }, num(rb?.peak.value)),
      el('td', { class: 'num', 'data-share': id }, '—'),
      el('td', { class: 'num' }, num(loss ?? null)));
  });
  beamList.replaceChildren(el('table', {},
    el('thead', {}, el('tr', {}, el('th', {}, 'on'), el('th', {}, 'beam'), el('th', {}, `peak ${u.valueUnit}`), el('th', {}, 'best share now'),
      el('th', { title: `results.json: loss of the ${data.removalLevelPct} % level when this beam alone is removed` }, `${data.removalLevelPct} % loss if removed, dB`))),
    el('tbody', {}, ...rows)));
}

/** Recompute and redraw; body[data-busy] is set meanwhile (scripts wait for it to go). */
async function update(): Promise<void> {
  document.body.dataset.busy = '1';
  try {
    await redrawAll();
  } finally {
    delete document.body.dataset.busy;
  }
}

async function redrawAll(): Promise<void> {
  const u = data.units[state.unit];
  const L = state.loaded;
  if (!L) return;
  state.computed = recompute(L.m, state.enabled, data, holeThresholdOf(u.result));
  const c = state.computed;
  const allOn = state.enabled.every(Boolean);
  const off = u.beamIds.filter((_, k) => !state.enabled[k]);
  // Verdict and checks.
  verdictBox.className = `verdict ${c ? c.verdict : 'none'}`;
  verdictBox.textContent = c
    ? `${verdictText(c.verdict)}${allOn ? '' : ` with beam(s) ${off.join(', ')} off`} — results.json: ${verdictText(u.result.verdict)}${c.worstCheck ? `; worst check now: ${c.worstCheck.name}` : ''}`
    : 'Every beam is off: nothing to compute.';
  renderChecks(u, c);
  renderPercentiles(u, c);
  renderHoles(c);
  for (const td of beamList.querySelectorAll<HTMLElement>('td[data-share]')) {
    const k = u.beamIds.indexOf(td.dataset.share as string);
    const j = c ? c.beamIndex.indexOf(k) : -1;
    td.textContent = j >= 0 && c ? pctText(c.metrics.beams[j].bestShare) : '—';
  }
  await computeDiff();
  paintViews();
  renderPlots(u, c);
  showReadout(lastPointer ?? mapView.getCursor(), true);
}

async function computeDiff(): Promise<void> {
  state.diff = null;
  const c = state.computed, L = state.loaded;
  if (!c || !L || !state.compareKey) return;
  const key = state.compareKey.slice(state.compareKey.indexOf(':') + 1);
  const other = [...data.units, ...data.referenceUnits].find((o) => o.key === key);
  if (!other) return;
  const O = await load(other);
  state.diff = tspDifference(L.m.grid, c.tsp, O.m.grid, { values: O.fullTsp, bestBeam: new Int32Array(O.fullTsp.length) });
}

let scale: Scale | null = null;
function paintViews(): void {
  const c = state.computed, L = state.loaded;
  if (!L) return;
  const u = data.units[state.unit];
  let colors: Uint8ClampedArray;
  const n = L.m.grid.thetaDeg.length;
  if (!c) { colors = new Uint8ClampedArray(4 * n); scale = null; }
  else if (state.mode === 'best') { colors = beamColors(c.tsp.bestBeam); scale = null; }
  else if (state.mode === 'diff' && state.diff) { scale = diffScale(state.diff); colors = pointColors(state.diff, scale, data.colorMap); }
  else { scale = valueScaleOf(L.fullTsp, u.quantity); colors = pointColors(c.tsp.values, scale, data.colorMap); }
  mapView.paint(colors);
  sphere?.paint(colors);
  renderColorBar(u);
}

function renderColorBar(u: ViewerUnit): void {
  if (!scale) {
    if (state.mode === 'best' && state.computed) {
      const ids = state.computed.beamIndex.map((k) => el('span', { class: 'key' }, el('span', { class: 'swatch', style: `background:${beamCss(k)}` }), u.beamIds[k]));
      colorBar.replaceChildren(el('span', {}, 'best beam: '), ...ids);
    } else colorBar.replaceChildren(state.mode === 'diff' ? 'Choose a unit to compare with.' : '');
    return;
  }
  const s = scale;
  const stops = Array.from({ length: 11 }, (_, k) => `${cssColorAt(s, data.colorMap, k / 10)} ${k * 10}%`).join(',');
  const unitText = s.diverging ? `dB (this unit − ${compareSelect.selectedOptions[0]?.textContent ?? ''})` : u.valueUnit;
  const lo = s.invert ? s.hi : s.lo, hi = s.invert ? s.lo : s.hi;
  colorBar.replaceChildren(
    el('span', {}, num(lo, 1)),
    el('span', { class: 'bar', style: `background:linear-gradient(to right,${stops})` }),
    el('span', {}, `${num(hi, 1)} ${unitText}`),
    el('span', { class: 'hint' }, s.diverging ? '' : u.quantity === 'eis' ? ' (right: better, lower EIS)' : ' (right: better)'));
}

function renderChecks(u: ViewerUnit, c: Computed | null): void {
  const rows = (c?.checks ?? []).map((ck, k) => {
    const orig = u.result.checks[k];
    const unit = ck.marginUnit === 'fraction' ? '' : ` ${u.valueUnit}`;
    const fmt = (v: number | null) => (ck.marginUnit === 'fraction' ? pctText(v) : `${num(v)}${unit}`);
    return el('tr', { class: ck.status },
      el('td', {}, ck.name),
      el('td', { class: 'num' }, fmt(ck.value)),
      el('td', { class: 'num' }, ck.marginUnit === 'fraction' ? `≥ ${pctText(ck.effectiveLimit)}` : `${ck.bound === 'upper' ? '≤' : '≥'} ${num(ck.effectiveLimit)}`),
      el('td', { class: 'num' }, ck.marginUnit === 'fraction' ? `${pctText(ck.margin)} (${num(ck.marginDb ?? null)} dB)` : num(ck.margin)),
      el('td', {}, ck.status),
      el('td', { class: 'orig' }, orig ? orig.status : '—'));
  });
  checksTable.replaceChildren(
    el('thead', {}, el('tr', {}, el('th', {}, 'check'), el('th', {}, 'value now'), el('th', {}, 'limit (with tolerance)'), el('th', {}, 'margin'), el('th', {}, 'now'), el('th', {}, 'results.json'))),
    el('tbody', {}, ...(rows.length ? rows : [el('tr', {}, el('td', { colspan: 6 }, data.limitSet ? 'nothing to judge' : 'No limit set in this run.'))])));
}

function renderPercentiles(u: ViewerUnit, c: Computed | null): void {
  const rows = u.result.tsp.percentiles.map((p) => {
    const now = c?.metrics.percentiles.find((q) => q.levelPct === p.levelPct)?.value ?? null;
    const d = now !== null && p.value !== null ? now - p.value : null;
    return el('tr', { 'data-level': p.levelPct },
      el('td', {}, `${p.levelPct} %`), el('td', { class: 'num' }, num(p.value)), el('td', { class: 'num now', 'data-value': now ?? '' }, num(now)), el('td', { class: 'num' }, num(d)));
  });
  const cov = u.result.tsp.coverage.map((p) => {
    const now = c?.metrics.coverage.find((q) => q.threshold === p.threshold)?.efficiency ?? null;
    return el('tr', { 'data-threshold': p.threshold },
      el('td', {}, `≥ ${num(p.threshold)} ${u.valueUnit}`.replace('≥', u.quantity === 'eis' ? '≤' : '≥')), el('td', { class: 'num' }, pctText(p.efficiency)), el('td', { class: 'num now', 'data-value': now ?? '' }, pctText(now)),
      el('td', { class: 'num' }, now === null ? '—' : `${num(100 * (now - p.efficiency), 1)} pt`));
  });
  pctTable.replaceChildren(
    el('thead', {}, el('tr', {}, el('th', {}, 'level / threshold'), el('th', {}, 'results.json'), el('th', {}, 'now'), el('th', {}, 'change'))),
    el('tbody', {}, ...rows, ...cov));
}

/** The unit's own hole threshold as results.json records it (per unit: a limit set for another quantity gives none); the build's for older results. */
function holeThresholdOf(r: UnitResult): number | null {
  return r.analysisThreshold !== undefined ? (r.analysisThreshold?.value ?? null) : data.holeThreshold;
}

function renderHoles(c: Computed | null): void {
  const u = data.units[state.unit];
  const hT = holeThresholdOf(u.result);
  if (hT === null) { holesBox.replaceChildren('No coverage threshold in this run, so no hole search.'); return; }
  const holes = c?.holes ?? [];
  const orig = u.result.holes?.length ?? 0;
  holesBox.replaceChildren(
    el('p', {}, `Regions worse than ${num(hT)} ${u.valueUnit}: ${holes.length} now (results.json: ${orig}).`),
    el('ol', {}, ...holes.slice(0, 8).map((h) => {
      const li = el('li', {}, el('button', { type: 'button', class: 'link' }, `θ ${num(h.thetaDeg, 1)}°, φ ${num(h.phiDeg, 1)}°`),
        `: ${num(h.solidAngleSr, 3)} sr, worst ${num(h.worst)} ${u.valueUnit}, nearest beam ${h.nearestBeam}`);
      (li.firstChild as HTMLButtonElement).addEventListener('click', () => { mapView.setCursor(h, true); sphere?.face(h.thetaDeg, h.phiDeg); });
      return li;
    })));
}

function renderPlots(u: ViewerUnit, c: Computed | null): void {
  const L = state.loaded as Loaded;
  const w = L.m.grid.weightSr;
  const ls = data.limitSet;
  const pctChecks = (c?.checks ?? []).filter((k) => k.kind === 'percentile');
  const full = cdfCurve(L.fullTsp, w, u.quantity);
  const series = [{ x: full.values, y: full.fractions, color: '#9a9a9a', width: 1.5, step: true, label: 'all beams' }];
  const now = c ? cdfCurve(c.tsp.values, w, u.quantity) : null;
  if (now) series.push({ x: now.values, y: now.fractions, color: '#1f4e9a', width: 2, step: true, label: 'now' });
  const cdfNow = c ? weightedCdf(c.tsp.values, w) : null;
  cdfPlot.set({
    xLabel: `${u.quantity.toUpperCase()} of the total scan pattern, ${u.valueUnit}`,
    yLabel: 'share of 4π at or below',
    series,
    markers: pctChecks.map((k) => ({ x: k.effectiveLimit, y: (k.levelPct ?? 0) / 100, label: `${k.levelPct} %: ${num(k.effectiveLimit)}`, pass: k.pass })),
    readout: (_x, y) => {
      if (!cdfNow) return null;
      const lvl = Math.round(y * 1000) / 10;
      return `level ${lvl} %: ${num(percentile(cdfNow, lvl, u.quantity))} ${u.valueUnit} (${ls ? 'limits marked' : 'no limits'})`;
    },
  });
  const curve = c ? c.metrics.curve : [];
  const covChecks = (c?.checks ?? []).filter((k) => k.kind === 'min-coverage');
  covPlot.set({
    xLabel: `threshold, ${u.valueUnit}`,
    yLabel: 'coverage efficiency',
    series: [{ x: curve.map((p) => p.threshold), y: curve.map((p) => p.efficiency), color: '#1f4e9a', width: 2, step: false, label: 'now' }],
    markers: covChecks.map((k) => ({ x: k.threshold ?? 0, y: k.effectiveLimit, label: `${pctText(k.effectiveLimit, 0)} at ${num(k.threshold ?? null, 1)}`, pass: k.pass })),
    readout: (x) => (cdfNow ? `threshold ${num(x, 1)} ${u.valueUnit}: ${pctText(coverageEfficiency(cdfNow, Math.round(x * 10) / 10, u.quantity))} of 4π` : null),
  });
}

// ---------- read-out ----------
/** The direction last under the pointer (the read-out follows it through recomputations). */
let lastPointer: Dir | null = null;

function showReadout(d: Dir | null, fromCursor: boolean): void {
  if (!fromCursor) lastPointer = d;
  const L = state.loaded, c = state.computed;
  const u = data.units[state.unit];
  const dir = d ?? (fromCursor ? null : mapView.getCursor());
  sphere?.setMarker(dir);
  mapView.setHover(dir);
  if (!L || !dir) { readout.replaceChildren(el('dt', {}, 'Point at the map or the sphere (or focus the map and use the arrow keys).')); return; }
  const i = L.lookup(dir.thetaDeg, dir.phiDeg);
  // Each line: label, text, field name, and the raw number (data-value, for scripts and tests).
  const items: [string, string, string, string][] = [['pointer', `θ ${num(dir.thetaDeg, 1)}°, φ ${num(dir.phiDeg, 1)}°`, 'pointer', '']];
  if (i < 0) items.push(['grid point', 'not measured', 'point', '']);
  else {
    const g = L.m.grid;
    items.push(['grid point', `θ ${num(g.thetaDeg[i], 2)}°, φ ${num(g.phiDeg[i], 2)}°`, 'point', `${g.thetaDeg[i]},${g.phiDeg[i]}`]);
    items.push(['value', c ? `${num(c.tsp.values[i])} ${u.valueUnit}` : '—', 'value', c ? String(c.tsp.values[i]) : '']);
    const b = beamsAt(L.m, state.enabled, i);
    items.push(['best beam', b.best >= 0 ? u.beamIds[b.best] : '—', 'best', b.best >= 0 ? u.beamIds[b.best] : '']);
    items.push(['margin to 2nd best', b.second >= 0 ? `${num(b.marginDb)} dB (beam ${u.beamIds[b.second]})` : '— (one beam on)', 'margin', String(b.marginDb ?? '')]);
    items.push(['cell solid angle', `${g.weightSr[i].toExponential(4)} sr`, 'solid-angle', String(g.weightSr[i])]);
    if (state.diff) items.push(['difference', `${num(state.diff[i])} dB`, 'diff', String(state.diff[i])]);
  }
  readout.replaceChildren(...items.flatMap(([k, v, id, raw]) => [el('dt', {}, k), el('dd', { 'data-field': id, 'data-value': raw }, v)]));
}

mapCanvas.addEventListener('keydown', (e) => {
  const L = state.loaded;
  if (!L) return;
  const cur = mapView.getCursor() ?? { thetaDeg: 90, phiDeg: data.mapCenterPhiDeg };
  const r = L.m.grid.regular;
  const dT = r && r.thetaRowsDeg.length > 1 ? Math.abs(r.thetaRowsDeg[1] - r.thetaRowsDeg[0]) : 2;
  const dP = r && r.phiColsDeg.length > 1 ? Math.abs(r.phiColsDeg[1] - r.phiColsDeg[0]) : 2;
  const next = { ...cur };
  if (e.key === 'ArrowUp') next.thetaDeg = Math.max(0, cur.thetaDeg - dT);
  else if (e.key === 'ArrowDown') next.thetaDeg = Math.min(180, cur.thetaDeg + dT);
  else if (e.key === 'ArrowLeft') next.phiDeg = (cur.phiDeg - dP + 360) % 360;
  else if (e.key === 'ArrowRight') next.phiDeg = (cur.phiDeg + dP) % 360;
  else return;
  e.preventDefault();
  mapView.setCursor(next, true);
});

modeSelect.addEventListener('change', () => {
  state.mode = modeSelect.value as MapMode;
  if (state.mode === 'diff' && !state.compareKey && compareSelect.options.length > 1) {
    compareSelect.selectedIndex = 1;
    state.compareKey = compareSelect.value;
  }
  void update();
});
compareSelect.addEventListener('change', () => {
  state.compareKey = compareSelect.value;
  if (state.compareKey) { state.mode = 'diff'; modeSelect.value = 'diff'; }
  void update();
});
(document.getElementById('all-on') as HTMLButtonElement).addEventListener('click', () => {
  state.enabled = state.enabled.map(() => true);
  for (const b of beamList.querySelectorAll<HTMLInputElement>('input[type=checkbox]')) b.checked = true;
  void update();
});
window.addEventListener('resize', () => sphere?.resize());
window.addEventListener('beforeprint', () => sphere?.render());

/** A small hook for scripted checks (the browser tests): where a direction is on screen. */
(window as unknown as { spherecovViewer: unknown }).spherecovViewer = {
  mapClientOf: (t: number, p: number) => mapView.clientOf(t, p),
  sphereClientOf: (t: number, p: number) => sphere?.clientOf(t, p) ?? null,
  faceSphere: (t: number, p: number) => sphere?.face(t, p),
  cdfClientOf: (x: number, y: number) => cdfPlot.clientOf(x, y),
  webgl: sphere !== null,
};

renderUnitsTable();
if (data.units.length) void chooseUnit(0);
else app.append(el('p', {}, 'This run produced no unit results.'));
