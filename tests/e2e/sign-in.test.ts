import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser } from 'playwright-core';
import { startServer, type RunningServer } from '../helpers/server';
import { islandsHydrated, launchBrowser, SCREENSHOT_DIR } from '../helpers/browser';
import { demoAccounts } from '../../src/demo/accounts';

let server: RunningServer;
let browser: Browser;
beforeAll(async () => {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  [server, browser] = await Promise.all([startServer(), launchBrowser()]);
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

// What each role's header must list (DESIGN.md roles; screens that exist so far).
const expectedNav: Record<string, string[]> = {
  admin: ['Specs', 'Compare', 'Sweep', 'Shortlists', 'Parts library', 'Briefs', 'Team', 'Outbox'],
  architect: ['Specs', 'Compare', 'Sweep', 'Shortlists', 'Parts library', 'Briefs'],
  engineer: ['Specs', 'Compare', 'Sweep', 'Shortlists', 'Parts library', 'Briefs'],
  sales: ['Specs', 'Compare', 'Shortlists', 'Parts library', 'Briefs'],
};

describe('signing in through the browser', () => {
  it('the sign-in page lists the demo accounts and marks the workspace fictional', async () => {
    const page = await browser.newPage({ viewport: { width: 1280, height: 800 } });
    await page.goto(`${server.url}/sign-in`);
    await islandsHydrated(page);
    await expect.poll(() => page.locator('[data-demo-notice]').textContent()).toMatch(/fictional/);
    for (const account of demoAccounts) await page.getByText(account.email).waitFor();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'sign-in.png'), fullPage: true });
    await page.close();
  });

  it('shows a plain message for a wrong password', async () => {
    const page = await browser.newPage();
    await page.goto(`${server.url}/sign-in`);
    await islandsHydrated(page);
    await page.getByLabel('E-mail').fill('architect@resetwise.example');
    await page.getByLabel('Password').fill('not-the-password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await expect.poll(() => page.getByRole('alert').textContent()).toMatch(/e-mail or password is wrong/);
    await page.close();
  });

  const roles = [...new Map(demoAccounts.map((a) => [a.role, a])).values()];
  it.each(roles.map((a) => [a.role, a.email] as const))('%s signs in and sees the right navigation', async (role, email) => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 800 } });
    const page = await context.newPage();
    await page.goto(`${server.url}/team`);
    await page.waitForURL(/\/sign-in\?next=%2Fteam/);
    await islandsHydrated(page);
    await page.getByLabel('E-mail').fill(email);
    await page.getByLabel('Password').fill('resetwise-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/team');
    const nav = await page.getByRole('navigation', { name: 'Screens' }).getByRole('link').allTextContents();
    expect(nav.map((t) => t.trim())).toEqual(expectedNav[role]);
    await expect.poll(() => page.locator('[data-current-user] [data-role]').getAttribute('data-role')).toBe(role);
    if (role === 'admin') {
      await page.getByRole('heading', { name: 'Team' }).waitFor();
      await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'team-admin.png'), fullPage: true });
    } else {
      await page.getByRole('heading', { name: 'Your role does not open this screen' }).waitFor();
    }
    await page.goto(`${server.url}/`);
    await page.waitForURL((url) => url.pathname === '/specs');
    await page.locator('[data-spec-table]').waitFor();
    expect(await page.locator('[data-safety-caution]').count()).toBe(1);
    expect(await page.getByRole('link', { name: 'New requirement set' }).count()).toBe(role === 'admin' || role === 'architect' ? 1 : 0);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, `specs-${role}.png`), fullPage: true });
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in\?signedOut=1/);
    await page.goto(`${server.url}/`);
    await page.waitForURL(/\/sign-in/);
    await context.close();
  });

  it('an admin adds a member from the Team page by keyboard and mouse', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    await page.goto(`${server.url}/sign-in`);
    await islandsHydrated(page);
    await page.getByLabel('E-mail').fill('admin@resetwise.example');
    await page.getByLabel('Password').fill('resetwise-demo');
    await page.keyboard.press('Enter');
    await page.waitForURL(`${server.url}/specs`);
    await page.goto(`${server.url}/team`);
    await islandsHydrated(page);
    await page.getByLabel('Display name').fill('Rosa Lindqvist');
    await page.getByLabel('E-mail').fill('not-an-email');
    await page.getByLabel('Initial password (10+ characters)').fill('rosa-password-1');
    await page.getByRole('button', { name: 'Add member' }).click();
    await page.getByText('email must be an e-mail address').waitFor();
    await page.getByLabel('E-mail').fill('rosa@halvard.example');
    await page.getByLabel('Role', { exact: true }).selectOption('sales');
    await page.getByRole('button', { name: 'Add member' }).click();
    await page.locator('[data-member="rosa@halvard.example"]').waitFor();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'team-added.png'), fullPage: true });
    await context.close();
  });

  // Issue 16: the tab survives the page's own check and the browser drops it, which made `//evil.example`.
  it.each([true, false])('with a tab in next (/%%09/evil.example) the browser stays on this server, JavaScript on: %s', async (javaScriptEnabled) => {
    const context = await browser.newContext({ javaScriptEnabled });
    const page = await context.newPage();
    await page.goto(`${server.url}/sign-in?next=%2F%09%2Fevil.example%2Fsteal`);
    if (javaScriptEnabled) await islandsHydrated(page);
    await page.getByLabel('E-mail').fill('engineer@resetwise.example');
    await page.getByLabel('Password').fill('resetwise-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname !== '/sign-in');
    expect(new URL(page.url()).origin).toBe(server.url);
    await context.close();
  });

  it('no screen breaks its Content-Security-Policy (no inline script is blocked, workers start)', async () => {
    const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const page = await context.newPage();
    const violations: string[] = [];
    page.on('console', (message) => {
      if (/Content Security Policy/i.test(message.text())) violations.push(`${page.url()}: ${message.text()}`);
    });
    await page.addInitScript(() => {
      document.addEventListener('securitypolicyviolation', (event) => console.error(`Content Security Policy violation: ${event.violatedDirective} ${event.blockedURI}`));
    });
    await page.goto(`${server.url}/sign-in`);
    await islandsHydrated(page);
    await page.getByLabel('E-mail').fill('admin@resetwise.example');
    await page.getByLabel('Password').fill('resetwise-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL((url) => url.pathname === '/specs');
    for (const screen of ['/specs', '/compare', '/compare/demo-spec-1', '/sweep/demo-spec-1', '/shortlists', '/parts', '/parts/history', '/briefs', '/team', '/outbox', '/specs/import', '/no/such/page']) {
      await page.goto(`${server.url}${screen}`);
      await islandsHydrated(page);
      await page.waitForLoadState('networkidle');
    }
    await page.goto(`${server.url}/sweep/demo-spec-1`);
    // The workers report their warm-up: they loaded and ran under the page's policy.
    await page.waitForFunction(() => ((window as unknown as { __sweepWarmedMs?: number[] }).__sweepWarmedMs ?? []).length > 0, undefined, { timeout: 60_000 });
    expect(violations).toEqual([]);
    await context.close();
  });
});
