/**
 * `spherecov inspect` and `spherecov limits`: thin wrappers over the readers and the limits module.
 */
import { listProfiles } from '../limits/listProfiles.js';
import { loadLimitSet } from '../limits/loadLimitSet.js';
import { formatLimitSet } from '../limits/formatLimitSet.js';
import type { BatchIo } from '../batch/options.js';
import type { Quantity } from '../types.js';
import { existsSync } from 'node:fs';
import { UsageError } from './parse.js';

export { formatInputError } from '../batch/errors.js';
import { formatInputError } from '../batch/errors.js';

export async function runInspect(
  target: string,
  opts: { json: boolean; quantity?: Quantity; jobFile?: string },
  io: BatchIo,
): Promise<number> {
  if (!existsSync(target)) throw new UsageError(`inspect: '${target}' does not exist; give a folder or a file of exports`);
  const { inspectInput, formatInspect } = await import('../io/inspectInput.js');
  const report = await inspectInput(target, { quantity: opts.quantity, job: opts.jobFile });
  if (opts.json) io.stdout(JSON.stringify(report, null, 2) + '\n');
  else io.stdout(formatInspect(report));
  const errors = (report as { errors?: unknown[] }).errors;
  return Array.isArray(errors) && errors.length > 0 ? 2 : 0;
}

export async function runLimits(name: string | undefined, io: BatchIo): Promise<number> {
  if (name === undefined) {
    const profiles = listProfiles();
    const width = Math.max(4, ...profiles.map((p) => p.name.length));
    const lines = [`${'name'.padEnd(width)}  quantity  checks  description`];
    for (const p of profiles) {
      lines.push(`${p.name.padEnd(width)}  ${p.quantity.padEnd(8)}  ${String(p.checks).padStart(6)}  ${p.description}`);
    }
    lines.push('', 'Print one with `spherecov limits <name>`; use it with `spherecov analyze <input> --out <dir> --limits <name>`.');
    io.stdout(lines.join('\n') + '\n');
    return 0;
  }
  const { limitSet, errors, notices } = loadLimitSet(name);
  // Keys in an old spelling: the set is read, and the notice says which key to rename.
  for (const n of notices) io.stderr(`spherecov: ${formatInputError(n)}\n`);
  if (!limitSet) {
    for (const e of errors) io.stderr(`spherecov: ${formatInputError(e)}\n`);
    return 2;
  }
  io.stdout(formatLimitSet(limitSet));
  return 0;
}
