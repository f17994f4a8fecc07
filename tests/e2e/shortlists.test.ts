import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { startServer, type RunningServer } from '../helpers/server';
import { islandsHydrated, launchBrowser, SCREENSHOT_DIR, signInThroughForm } from '../helpers/browser';

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

const as = (email: string): Promise<Page> => signInThroughForm(browser, server.url, email, { acceptDialogs: true });

const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`), fullPage: true });

describe('a full shortlist round in the browser', () => {
  it('architect builds and opens, two engineers vote, architect closes and decides, sales sees the decision', async () => {
    const architect = await as('architect@resetwise.example');
    await architect.goto(`${server.url}/compare/demo-spec-2`);
    const add = architect.locator('[data-add-to-shortlist]');
    await add.waitFor();
    await add.getByLabel('Add to shortlist').selectOption('two-switch');
    await add.getByLabel('Title').fill('Server stage: reset scheme');
    await add.getByLabel('Note').fill('600 V parts, no reset winding');
    await add.getByRole('button', { name: 'Add' }).click();
    await add.getByText('Two-switch added').waitFor();
    for (const [scheme, note] of [['active-clamp', 'lowest stress at 300 V'], ['tertiary-winding', 'one switch, reset winding']] as const) {
      await add.getByLabel('Add to shortlist').selectOption(scheme);
      await add.getByLabel('Note').fill(note);
      await add.getByRole('button', { name: 'Add' }).click();
      await add.getByText(/added, frozen from saved version/).filter({ hasText: scheme === 'active-clamp' ? 'Active clamp' : 'Tertiary winding' }).waitFor();
    }
    await shot(architect, 'compare-add-to-shortlist');
    await add.getByRole('link', { name: 'Open the shortlist' }).click();
    await architect.waitForURL(/\/shortlists\//);
    await islandsHydrated(architect);
    expect(await architect.locator('[data-candidate]').count()).toBe(3);
    const owner = architect.locator('[data-owner-actions]');
    await owner.getByLabel(/Priya Raman/).check();
    await owner.getByLabel(/Tomasz Wójcik/).check();
    await shot(architect, 'shortlist-draft-architect');
    await owner.getByRole('button', { name: 'Open voting' }).click();
    await architect.locator('[data-status="voting"]').waitFor();
    const shortlistUrl = architect.url();

    for (const [email, moves] of [['engineer@resetwise.example', 0], ['engineer2@resetwise.example', 1]] as const) {
      const voter = await as(email);
      await voter.goto(shortlistUrl);
      await islandsHydrated(voter);
      const ballot = voter.locator('[data-ballot]');
      await ballot.waitFor();
      await expect.poll(() => voter.locator('[data-tally-hidden]').count()).toBe(1);
      if (moves) await ballot.getByRole('button', { name: 'Move Active clamp up' }).click();
      if (email === 'engineer@resetwise.example') {
        const row = ballot.locator('[data-ballot-row="tertiary-winding"]');
        await row.getByLabel('Blocking concern').check();
        await row.getByLabel(/Reason for the concern/).fill('2·Vin plus spike needs 1200 V parts');
        await shot(voter, 'shortlist-ballot-engineer');
      }
      await ballot.getByRole('button', { name: 'Cast my ballot' }).click();
      await voter.locator('[data-tally] table').waitFor();
      await voter.context().close();
    }

    await architect.reload();
    await islandsHydrated(architect);
    await architect.locator('[data-owner-actions]').getByRole('button', { name: 'Close voting' }).click();
    await architect.locator('[data-status="closed"]').waitFor();
    await architect.locator('[data-tally-row="Two-switch"]').waitFor();
    expect(await architect.locator('[data-tally]').textContent()).toContain('2·Vin plus spike needs 1200 V parts');
    const decide = architect.locator('[data-owner-actions]');
    await decide.getByLabel('Chosen candidate').selectOption({ label: 'Two-switch' });
    await decide.getByLabel('Rationale').fill('Two-switch: 600 V parts at 410 V, highest Borda score, no blocking concern.');
    await decide.getByRole('button', { name: 'Record decision' }).click();
    await architect.locator('[data-status="decided"]').waitFor();
    await shot(architect, 'shortlist-decided-architect');
    await architect.context().close();

    const sales = await as('sales@resetwise.example');
    await sales.getByRole('link', { name: 'Shortlists' }).click();
    await sales.getByRole('link', { name: 'Server stage: reset scheme' }).click();
    await sales.locator('[data-decision]').getByText('Decision: Two-switch').waitFor();
    expect(await sales.locator('[data-owner-actions]').count()).toBe(0);
    expect(await sales.locator('[data-ballot]').count()).toBe(0);
    expect(await sales.locator('[data-history] li').count()).toBeGreaterThanOrEqual(8);
    await shot(sales, 'shortlist-decided-sales');
    await sales.context().close();
  }, 120_000); // four signed-in browsers in turn: about 18 s alone, well over 30 s while the rest of the suite runs beside it
});
