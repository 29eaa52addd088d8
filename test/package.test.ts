import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { ensureBuilt, ROOT } from './cli/buildOnce.js';

describe('package.json', () => {
  beforeAll(() => ensureBuilt(), 180_000);
  it('every folder the package ships exists (a missing one ships nothing and says nothing)', () => {
    const pkg = JSON.parse(readFileSync(path.join(ROOT, 'package.json'), 'utf8')) as { files: string[] };
    expect(pkg.files.filter((f) => !existsSync(path.join(ROOT, f)))).toEqual([]);
  });
});
