/**
 * Headless Debian chromium driven by playwright-core, for the viewer.html tests. CI installs the
 * browser (`.ci/run`: apt-get install chromium); where it is absent the tests are skipped with a
 * message. A fresh profile folder per launch; no network, no background services.
 */
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { BrowserContext } from 'playwright-core';

export const CHROMIUM = '/usr/bin/chromium';
export const haveChromium = existsSync(CHROMIUM);
if (!haveChromium) {
  console.warn(`viewer browser tests skipped: ${CHROMIUM} is not installed (apt-get install chromium; .ci/run does this)`);
}

export async function launch(): Promise<{ ctx: BrowserContext; close: () => Promise<void> }> {
  const { chromium } = await import('playwright-core');
  const profile = mkdtempSync(path.join(tmpdir(), 'spherecov-chromium-'));
  const ctx = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    viewport: { width: 1500, height: 1100 },
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking',
      '--disable-component-update', '--disable-sync'], // the fresh profile is playwright's --user-data-dir
  });
  return { ctx, close: async () => { await ctx.close(); rmSync(profile, { recursive: true, force: true }); } };
}
