#!/usr/bin/env node
// Node port of /work/shared/bench/gen.py (same columns, row order, pattern model and 2-decimal
// values; the noise comes from a different generator, so values differ from gen.py's in the
// noise only). Used when /usr/bin/python3 with numpy is not there (e.g. in CI).
//
//   node bench/gen.mjs OUT.csv --beams 64 --step 1 [--seed 1]
import { createWriteStream } from 'node:fs';
import { resolve } from 'node:path';
import { fileURLToPath } from 'node:url';

/** Deterministic N(0, 1) stream: mulberry32 uniforms through Box–Muller. */
function normalStream(seed) {
  let s = seed >>> 0;
  const uni = () => {
    s = (s + 0x6d2b79f5) >>> 0;
    let t = s;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  return () => Math.sqrt(-2 * Math.log(1 - uni())) * Math.cos(2 * Math.PI * uni());
}

/** Write the export; resolves to the number of data rows. */
export async function generate(out, { beams = 64, step = 1, seed = 1 } = {}) {
  const nth = Math.round(180 / step) + 1;
  const nph = Math.round(360 / step);
  const n = nth * nph;
  const ux = new Float64Array(n), uy = new Float64Array(n), uz = new Float64Array(n);
  const thText = new Array(n), phText = new Array(n);
  for (let i = 0; i < nth; i++) {
    for (let j = 0; j < nph; j++) {
      const k = i * nph + j;
      const t = (i * step * Math.PI) / 180;
      const p = (j * step * Math.PI) / 180;
      ux[k] = Math.sin(t) * Math.cos(p);
      uy[k] = Math.sin(t) * Math.sin(p);
      uz[k] = Math.cos(t);
      thText[k] = String(+(i * step).toFixed(6));
      phText[k] = String(+(j * step).toFixed(6));
    }
  }
  const gauss = normalStream(seed);
  const ws = createWriteStream(out);
  const write = (s) => (ws.write(s) ? null : new Promise((r) => ws.once('drain', r)));
  await write('theta_deg,phi_deg,beam,eirp_dbm\n');
  const nEl = 8;
  const nAz = Math.max(1, Math.floor(beams / nEl));
  const rad = Math.PI / 180;
  for (let b = 0; b < beams; b++) {
    const iEl = b % nEl, iAz = Math.floor(b / nEl) % nAz;
    const bt = (10 + (140 * iEl) / (nEl - 1)) * rad;
    const bp = ((360 * iAz) / nAz + 7 * iEl) * rad;
    const bx = Math.sin(bt) * Math.cos(bp), by = Math.sin(bt) * Math.sin(bp), bz = Math.cos(bt);
    const sigma = (12 + 4 * Math.abs(Math.cos(bt))) * rad;
    const peak = 30 - 4 * (1 - Math.abs(Math.cos(bt))) + (0.1 * b) / beams;
    let chunk = '';
    for (let k = 0; k < n; k++) {
      const c = Math.min(1, Math.max(-1, ux[k] * bx + uy[k] * by + uz[k] * bz));
      const psi = Math.acos(c);
      const lin = Math.exp(-0.5 * (psi / sigma) ** 2) + 10 ** -2.2 * (1 + c) / 2 + 10 ** -3.5;
      const db = peak + 10 * Math.log10(lin) + 0.25 * gauss();
      chunk += `${thText[k]},${phText[k]},${b},${db.toFixed(2)}\n`;
      if (chunk.length > 1 << 20) {
        await write(chunk);
        chunk = '';
      }
    }
    await write(chunk);
  }
  await new Promise((r, j) => ws.end((e) => (e ? j(e) : r())));
  return beams * n;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === resolve(process.argv[1])) {
  const [out, ...rest] = process.argv.slice(2);
  const opt = {};
  for (let i = 0; i < rest.length; i += 2) opt[rest[i].replace(/^--/, '')] = Number(rest[i + 1]);
  const rows = await generate(out, opt);
  process.stderr.write(`${out}: ${rows} rows\n`);
}
