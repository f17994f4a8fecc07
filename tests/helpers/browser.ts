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

/**
 * A fresh browser context signed in through the sign-in form as `email` (demo password), on
 * Specs. `acceptDialogs` answers confirm() prompts with OK.
 */
export async function signInThroughForm(
  browser: import('playwright-core').Browser,
  url: string,
  email: string,
  options: { acceptDialogs?: boolean; width?: number; height?: number } = {},
): Promise<import('playwright-core').Page> {
  const context = await browser.newContext({ viewport: { width: options.width ?? 1280, height: options.height ?? 900 } });
  const page = await context.newPage();
  if (options.acceptDialogs) page.on('dialog', (dialog) => void dialog.accept());
  await page.goto(`${url}/sign-in`);
  await islandsHydrated(page);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('resetwise-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => u.pathname === '/specs');
  return page;
}
