#!/usr/bin/env node
// How much two CPU-bound processes gain from running side by side on this machine: the same
// fixed work (a numeric loop of the kind the metrics do) once alone and twice at once, as
// separate processes. Prints {"aloneS", "pairS", "ratio"} where ratio = pair wall / (2 × alone):
// 0.5 is two full cores, 1.0 is one. It bounds what any --jobs 2 can reach here.
import { spawn } from 'node:child_process';

const WORK = `let s = 0; const a = new Float64Array(1 << 16);
for (let r = 0; r < 9000; r++) for (let i = 0; i < a.length; i++) { a[i] = a[i] * 0.5 + Math.sqrt(i + r); s += a[i]; }
if (s === 42) console.log(s);`;

const once = () => new Promise((resolve, reject) => {
  const p = spawn(process.execPath, ['-e', WORK], { stdio: 'ignore' });
  p.on('error', reject);
  p.on('exit', (code) => (code === 0 ? resolve() : reject(new Error(`exit ${code}`))));
});
const time = async (f) => { const t = process.hrtime.bigint(); await f(); return Number(process.hrtime.bigint() - t) / 1e9; };

const alone = [];
const pair = [];
for (let k = 0; k < 3; k++) {
  alone.push(await time(once));
  pair.push(await time(() => Promise.all([once(), once()])));
}
const med = (xs) => [...xs].sort((a, b) => a - b)[1];
console.log(JSON.stringify({ aloneS: med(alone), pairS: med(pair), ratio: med(pair) / (2 * med(alone)) }));
