import path from 'node:path';
import { chromium, type Browser } from 'playwright-core';

/** Debian's Chromium (playwright gives each launch a fresh profile), headless, with nothing that reaches the network on its own. */
export async function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    args: [
      '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
      '--disable-background-networking', '--disable-component-update', '--disable-sync',
      '--disable-dev-shm-usage',
    ],
  });
}

export const SCREENSHOT_DIR = path.resolve('test-output/screenshots');

/** Astro removes the `ssr` attribute from an island once React has hydrated it. */
export async function islandsHydrated(page: import('playwright-core').Page): Promise<void> {
  await page.waitForFunction(() => document.querySelectorAll('astro-island[ssr]').length === 0);
}
