/**
 * A package that only some runs need, loaded on its first use instead of at start-up.
 *
 * Why: every process and every worker thread of `analyze` paid for loading yaml, re2js and
 * d3-geo-voronoi (with d3-geo, d3-array, d3-delaunay, d3-tricontour under it: about 190 ES
 * modules) whether or not the run had a job file, a limit set, PDFs or a scattered grid — about
 * 0.15 s of CPU, measured with `node --cpu-prof` (issue 18). The callers are synchronous library
 * functions, so the package is loaded with a synchronous `require` (Node ≥ 20.19 loads the ES
 * module packages that way too), reached through `process.getBuiltinModule` so that this file
 * has no `node:` import and stays safe in the viewer's browser bundle: code that the page runs
 * gets its package handed in instead (`provide`), as src/viewer/compute.ts does for the
 * triangulation.
 *
 * Cost: one `require` on the first call, then a cached reference.
 * @throws Error when called outside Node without a provided module.
 * @example const yaml = lazyPackage<typeof import('yaml')>('yaml'); yaml().parse('a: 1') // { a: 1 }
 */
export interface LazyPackage<T> {
  (): T;
  /** Use this module instead of loading the package (the browser bundle imports it statically). */
  provide(mod: T): void;
}

export function lazyPackage<T>(name: string): LazyPackage<T> {
  let mod: T | undefined;
  const get = (): T => {
    if (mod === undefined) {
      const node = (globalThis as { process?: { getBuiltinModule?: (id: string) => unknown } }).process;
      const moduleApi = node?.getBuiltinModule?.('module') as typeof import('node:module') | undefined;
      if (!moduleApi) throw new Error(`package '${name}' is not available here: provide it before use (lazyPackage)`);
      mod = moduleApi.createRequire(import.meta.url)(name) as T;
    }
    return mod;
  };
  return Object.assign(get, { provide: (m: T) => void (mod = m) });
}
