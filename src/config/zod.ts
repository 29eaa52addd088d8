import type * as Zod from 'zod';
import { lazyPackage } from '../lazyPackage.js';

/**
 * zod, loaded on the first configuration file (or schema) a process needs, like yaml
 * (src/lazyPackage.ts): a run without a job file or limit set, every worker thread, and the
 * viewer page's bundle (which imports the check-kind registry) never load it.
 */
export const zodPackage = lazyPackage<typeof Zod>('zod');

/** The zod namespace (`z.number()` …), loaded on first use. */
export const zod = (): typeof Zod.z => zodPackage().z;

/**
 * A schema built on its first use and kept: the configuration schemas are functions, so that
 * importing a module that can validate never loads zod by itself.
 * @example const s = lazySchema(() => zod().number()); s().parse(1) // 1
 */
export function lazySchema<T>(build: () => T): () => T {
  let schema: T | undefined;
  return () => (schema ??= build());
}
