#!/usr/bin/env node
// `npm run demo`: analyze the bundled demo build into reports/demo/ and print its verdict table.
// Exit code 1 from analyze means "a unit failed a limit", which is what the demo is meant to show,
// so only a usage/read error (2) or a crash makes the demo itself fail.
import { spawnSync } from 'node:child_process';
import { readFileSync, readdirSync } from 'node:fs';
import { dirname, join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const input = join(root, 'fixtures', 'demo');
const out = join(root, 'reports', 'demo');

const run = spawnSync(process.execPath, [join(root, 'bin', 'spherecov.js'), 'analyze', input, '--out', out], {
  stdio: ['ignore', 'inherit', 'inherit'],
});
if (run.status !== 0 && run.status !== 1) {
  console.error(`demo: analyze ended with exit code ${run.status}`);
  process.exit(run.status ?? 2);
}

const results = JSON.parse(readFileSync(join(out, 'results.json'), 'utf8'));
const fmt = (v, d = 1) => (v === null || v === undefined ? '—' : Number(v).toFixed(d));
const rows = results.units.map((u) => {
  const ghz = u.frequencyHz === null ? '—' : (u.frequencyHz / 1e9).toFixed(2);
  const w = u.worstCheck;
  const margin = !w ? '' : w.marginUnit === 'fraction'
    ? `${fmt(100 * w.margin)} pt of 4π${w.marginDb == null ? '' : `, ${fmt(w.marginDb)} dB`}`
    : `${fmt(w.margin)} dB`;
  const worst = w ? `${w.name} (${margin})` : '—';
  return [u.unit, ghz, fmt(u.tsp.peak.value), u.verdict.toUpperCase(), worst];
});
const head = ['unit', 'GHz', 'peak', 'verdict', 'worst check (margin)'];
const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => String(r[i]).length)));
const line = (r) => r.map((c, i) => String(c).padEnd(widths[i])).join('  ');
console.log('\n' + line(head));
console.log(widths.map((w) => '-'.repeat(w)).join('  '));
for (const r of rows) console.log(line(r));
for (const e of results.errors) console.log(`input error: ${e.file}:${e.line ?? '?'}: ${e.message}`);

const pdfs = readdirSync(out).filter((f) => f.endsWith('.pdf')).sort();
console.log(`\nReports in ${relative(process.cwd(), out) || '.'}/: ${pdfs.join(', ')}`);
console.log('Open summary.pdf for the build, and <unit>.pdf for each unit.');
