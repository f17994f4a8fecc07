import { mkdirSync, writeFileSync, mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { signIn, startServer, type RunningServer } from '../helpers/server';
import { islandsHydrated, launchBrowser, SCREENSHOT_DIR } from '../helpers/browser';

let server: RunningServer;
let browser: Browser;
const work = mkdtempSync(path.join(tmpdir(), 'resetwise-parts-e2e-'));
beforeAll(async () => {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  [server, browser] = await Promise.all([startServer(), launchBrowser()]);
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

async function pageAs(role: string): Promise<Page> {
  const cookie = (await signIn(server.url, `${role}@resetwise.example`)).split('=');
  const context = await browser.newContext({ viewport: { width: 1280, height: 900 } });
  await context.addCookies([{ name: cookie[0]!, value: cookie.slice(1).join('='), url: server.url }]);
  return context.newPage();
}
const shot = (page: Page, name: string) => page.screenshot({ path: path.join(SCREENSHOT_DIR, name), fullPage: true });

describe('Parts library in the browser', () => {
  it('an admin previews an import (errors with line numbers, nothing applied), fixes it and applies it as one version', async () => {
    const page = await pageAs('admin');
    await page.goto(`${server.url}/parts`);
    await islandsHydrated(page);
    await page.locator('[data-parts-table="mosfets"]').waitFor();
    await shot(page, 'parts-admin.png');
    const csv = await (await page.request.get(`${server.url}/api/v1/parts/export.csv?category=mosfets`)).text();
    const [header, first, second] = csv.trimEnd().split('\n');
    const cells = first!.split(',');
    cells[header!.split(',').indexOf('id')] = 'halvard-nmos-40v-z';
    const added = cells.join(',');
    const changedCells = second!.split(',');
    changedCells[header!.split(',').indexOf('tier3Price')] = '0.41';
    const changed = changedCells.join(',');
    const badCells = [...cells];
    badCells[header!.split(',').indexOf('vdsV')] = 'forty';
    badCells[header!.split(',').indexOf('id')] = 'halvard-nmos-bad';
    const badFile = path.join(work, 'with-error.csv');
    const goodFile = path.join(work, 'mosfets-update.csv');
    writeFileSync(badFile, `${header}\n${added}\n${badCells.join(',')}\n`);
    writeFileSync(goodFile, `${header}\n${added}\n${changed}\n`);

    await page.getByRole('button', { name: 'Import CSV…' }).click();
    await page.getByLabel('CSV file').setInputFiles(badFile);
    await page.getByRole('button', { name: 'Preview' }).click();
    const errors = page.locator('[data-import-errors]');
    await errors.waitFor();
    await expect.poll(() => errors.textContent()).toMatch(/3halvard-nmos-badvdsV "forty" is not a number/);
    expect(await page.locator('[data-apply]').isDisabled()).toBe(true);
    await shot(page, 'parts-import-errors.png');

    await page.getByLabel('CSV file').setInputFiles(goodFile);
    await page.getByRole('button', { name: 'Preview' }).click();
    const preview = page.locator('[data-import-preview]');
    await expect.poll(() => preview.getByRole('status').textContent()).toMatch(/2 rows read against library version 1 — 1 to add, 1 to change, 0 to retire/);
    expect(await page.locator('[data-import-changes] tr[data-op="add"]').textContent()).toContain('halvard-nmos-40v-z');
    expect(await page.locator('[data-import-changes] tr[data-op="change"]').textContent()).toMatch(/tiers: .*10000: 0\.41/);
    await shot(page, 'parts-import-preview.png');
    expect(await page.locator('[data-parts-screen]').getAttribute('data-library-version')).toBe('1'); // nothing applied yet

    await page.getByRole('button', { name: 'Apply 2 changes as one new version' }).click();
    await expect.poll(() => page.locator('[data-parts-message]').textContent()).toBe('Imported mosfets-update.csv: library version 2.');
    expect(await page.locator('[data-parts-screen]').getAttribute('data-library-version')).toBe('2');
    await page.getByPlaceholder('id, description or value').fill('halvard');
    await page.locator('tr[data-part="halvard-nmos-40v-z"]').waitFor();
    await shot(page, 'parts-after-import.png');

    await page.goto(`${server.url}/parts/history`);
    await page.locator('[data-history-version="2"]').getByText('CSV import of mosfets-update.csv: 1 added, 1 changed (MOSFET)').waitFor();
    await shot(page, 'parts-history.png');
    await page.context().close();
  });

  it('an admin adds a part through the form; a bad value gets a plain message first', async () => {
    const page = await pageAs('admin');
    await page.goto(`${server.url}/parts`);
    await islandsHydrated(page);
    await page.locator('[data-tab="capacitors"]').click();
    await page.getByRole('button', { name: 'Add capacitor' }).click();
    const form = page.locator('[data-part-form]');
    await form.getByLabel('Id').fill('halvard-cap-polymer-220uf-16v');
    await form.getByLabel('Capacitance (F)').fill('220 µF');
    await form.getByLabel('Voltage rating (V)').fill('16 kg');
    await form.getByLabel('ESR (Ω)').fill('12 mΩ');
    await form.getByLabel('tier 1 unit price').fill('0.31');
    await form.getByRole('button', { name: 'Add part' }).click();
    await expect.poll(() => form.locator('#err-voltageV').textContent()).toMatch(/"kg" is not understood/);
    await shot(page, 'parts-add-error.png');
    await form.getByLabel('Voltage rating (V)').fill('16 V');
    await form.getByRole('button', { name: 'Add part' }).click();
    await expect.poll(() => page.locator('[data-parts-message]').textContent()).toMatch(/Added halvard-cap-polymer-220uf-16v as library version 3/);
    expect(await page.locator('tr[data-part="halvard-cap-polymer-220uf-16v"]').textContent()).toMatch(/220 µF16 V12 mΩ/);
    await page.context().close();
  });

  it.each(['architect', 'engineer', 'sales'])('%s reads the library without edit controls', async (role) => {
    const page = await pageAs(role);
    await page.goto(`${server.url}/parts`);
    await islandsHydrated(page);
    await page.locator('[data-parts-table="mosfets"]').waitFor();
    expect(await page.getByRole('button', { name: 'Import CSV…' }).count()).toBe(0);
    expect(await page.getByRole('button', { name: /^Edit / }).count()).toBe(0);
    expect(await page.locator('[data-library-note]').textContent()).toMatch(/invented/);
    if (role === 'sales') await shot(page, 'parts-sales.png');
    await page.context().close();
  });

  it('a saved set computed with an older library says so and re-evaluates on request', async () => {
    // demo-spec sets have no stored result; save one first (architect), then change the library.
    const architect = await pageAs('architect');
    const created = await architect.request.post(`${server.url}/api/v1/specs`, {
      headers: { origin: server.url },
      data: { name: 'Library drift (browser)', customer: 'Fjord Robotics (fictional)', requirements: { vinMinV: 36, vinNomV: 48, vinMaxV: 75, voutV: 12, ioutA: 12.5, fswHz: 250e3 } },
    });
    const { id } = await created.json();
    const admin = await pageAs('admin');
    const lib = await (await admin.request.get(`${server.url}/api/v1/parts`)).json();
    const chosen = lib.library.mosfets.find((m: { id: string }) => m.id === 'demo-nmos-200v-a');
    const put = await admin.request.put(`${server.url}/api/v1/parts/demo-nmos-200v-a`, { headers: { origin: server.url }, data: { part: { ...chosen, description: 'reviewed at the parts board' } } });
    expect(put.status()).toBe(200);
    await admin.context().close();

    const sales = await pageAs('sales');
    await sales.goto(`${server.url}/compare/${id}`);
    const notice = sales.locator('[data-library-changed]');
    await expect.poll(() => notice.textContent()).toMatch(/Parts library changed since this result\..*version 3.*now version 4/);
    await notice.getByRole('button', { name: 'Re-evaluate on the server' }).click();
    await sales.locator('[data-library-diff]').waitFor();
    expect(await notice.textContent()).toMatch(/Fresh result shown, not saved/);
    await shot(sales, 'compare-library-changed-sales.png');
    await sales.context().close();

    await architect.goto(`${server.url}/compare/${id}`);
    await architect.locator('[data-library-changed]').getByRole('button', { name: 'Re-evaluate on the server' }).click();
    await architect.getByRole('button', { name: 'Save with library version 4' }).click();
    await expect.poll(() => architect.getByText('Saved as version 2 with parts library version 4.').count()).toBe(1);
    const comparison = await (await architect.request.get(`${server.url}/api/v1/specs/${id}/comparison`)).json();
    expect(comparison).toMatchObject({ libraryChanged: false, storedLibraryVersion: '4' });
    await architect.context().close();
  });

  it('sales import a customer spec file and land on its comparison', async () => {
    const page = await pageAs('sales');
    await page.goto(`${server.url}/specs/import`);
    await islandsHydrated(page);
    await shot(page, 'spec-import-sales.png');
    const file = path.join(work, 'nordlys-rfq.csv');
    writeFileSync(file, 'field,value\nvinMinV,18 V\nvinNomV,24 V\nvinMaxV,36 V\nvoutV,5 V\nioutA,8 A\nfswHz,300 kHz\ncustomer,Nordlys Marine (fictional)\n');
    await page.locator('[data-spec-import] input[type=file]').setInputFiles(file);
    await page.getByRole('button', { name: 'Import and compare' }).click();
    await page.waitForURL(/\/compare\//);
    await page.locator('[data-original-file]').getByText('nordlys-rfq.csv').waitFor();
    await page.locator('[data-cards]').waitFor();
    await shot(page, 'spec-imported-compare.png');
    await page.context().close();
  });
});
