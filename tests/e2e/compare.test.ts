import { mkdirSync } from 'node:fs';
import { gzipSync } from 'node:zlib';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { startServer, type RunningServer } from '../helpers/server';
import { launchBrowser, SCREENSHOT_DIR, signInThroughForm } from '../helpers/browser';
import type {} from '../../src/lib/perf'; // window.__resetwiseUpdates

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

const signedInPage = (email: string): Promise<Page> => signInThroughForm(browser, server.url, email);

const SCHEMES = ['tertiary-winding', 'rcd-clamp', 'active-clamp', 'two-switch', 'resonant-reset'];

/** Every card's "Switch peak (steady)" figure, by scheme. */
async function switchPeaks(page: Page): Promise<Record<string, string>> {
  const peaks: Record<string, string> = {};
  for (const scheme of SCHEMES) {
    peaks[scheme] = (await page.locator(`[data-scheme-card="${scheme}"] [data-figure="Switch peak (steady)"]`).textContent()) ?? '';
  }
  return peaks;
}

const chartPixels = (page: Page, name: string) =>
  page.locator(`[data-chart="${name}"] canvas`).evaluate((canvas) => (canvas as HTMLCanvasElement).toDataURL());
const stressChartPixels = (page: Page) => chartPixels(page, 'switch-stress');

/** Every chart on Compare, by the name each reports when an edit redraws it (`chart:<name>`). */
const CHARTS = ['switch-stress', 'duty', 'losses', 'cost', 'waveform-drain', 'waveform-currents', 'waveform-secondary', 'waveform-inductor'];

/**
 * One edit's timing from `window.__resetwiseUpdates`: the cards island, the charts island and
 * every chart drawn after an update report how long after the edit they finished; the edit is
 * done when the last of them is.
 */
async function editTiming(page: Page): Promise<{ slowestMs: number; charts: string[]; renders: number }> {
  const updates = await page.evaluate(() => window.__resetwiseUpdates ?? []);
  const timed = updates.filter((u) => u.island === 'cards' || u.island === 'charts' || u.island.startsWith('chart:'));
  return {
    slowestMs: Math.max(...timed.map((u) => u.ms)),
    charts: [...new Set(updates.filter((u) => u.island.startsWith('chart:')).map((u) => u.island.slice('chart:'.length)))].sort(),
    renders: updates.length,
  };
}

const median = (values: number[]): number => [...values].sort((a, b) => a - b)[Math.floor(values.length / 2)]!;

describe('Compare in the browser', () => {
  it('reports the first-load JavaScript of Compare (gzipped)', async () => {
    const page = await signedInPage('engineer@resetwise.example');
    const scripts = new Map<string, number>();
    page.on('response', async (response) => {
      if (response.request().resourceType() !== 'script') return;
      const body = await response.body().catch(() => Buffer.alloc(0));
      scripts.set(response.url(), gzipSync(body).length);
    });
    await page.goto(`${server.url}/compare/demo-spec-1`);
    await page.locator('[data-scheme-card="two-switch"]').waitFor();
    await page.waitForLoadState('networkidle');
    const firstLoad = [...scripts.values()].reduce((a, b) => a + b, 0);
    await page.locator('[data-charts]').scrollIntoViewIfNeeded();
    await page.locator('[data-chart="switch-stress"] canvas').waitFor();
    await page.waitForLoadState('networkidle');
    const withCharts = [...scripts.values()].reduce((a, b) => a + b, 0);
    console.log(`Compare: first-load JavaScript ${(firstLoad / 1024).toFixed(1)} KB gzipped (${scripts.size} files after charts); ${(withCharts / 1024).toFixed(1)} KB once the charts are scrolled into view`);
    expect(firstLoad).toBeGreaterThan(0);
    expect(firstLoad).toBeLessThan(400 * 1024); // generous; the 180 KB target is reported, not asserted
    await page.context().close();
  });

  it('architect: edit the maximum input, every card and the stress chart follow, save, reload keeps it', async () => {
    const page = await signedInPage('architect@resetwise.example');
    await page.getByRole('link', { name: '380 V bus to 12 V, 500 W, 10 ms hold-up' }).click();
    await page.waitForURL(/\/compare\//);
    const vinMax = page.getByLabel('Input maximum');
    await expect.poll(() => vinMax.inputValue()).toBe('410 V');
    for (const scheme of SCHEMES) await page.locator(`[data-scheme-card="${scheme}"]`).waitFor();
    await page.locator('[data-charts]').scrollIntoViewIfNeeded();
    await page.locator('[data-chart="switch-stress"] canvas').waitFor();
    expect(await page.locator('[data-safety-caution]').count()).toBe(1);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'compare-architect-before.png'), fullPage: true });
    const before = await switchPeaks(page);
    const chartBefore = await stressChartPixels(page);

    await page.evaluate(() => { window.__resetwiseUpdates = []; });
    await vinMax.fill('425 V');
    await expect.poll(async () => (await switchPeaks(page))['two-switch']).toBe('425 V');
    const after = await switchPeaks(page);
    for (const scheme of SCHEMES) expect(after[scheme], scheme).not.toBe(before[scheme]);
    await expect.poll(() => stressChartPixels(page)).not.toBe(chartBefore);
    // The maximum input moves every chart's data (the sweeps end there, the design and the parts follow it), so all eight redraw.
    const first = await editTiming(page);
    expect(first.charts).toEqual([...CHARTS].sort());
    console.log(`Compare: first edit after load → every card and chart updated in ${first.slowestMs.toFixed(1)} ms (${first.charts.length} charts redrawn, ${first.renders} island and chart renders)`);
    expect(first.slowestMs).toBeLessThan(500); // generous bound; the target (≤ 50 ms) is reported, not asserted

    // Later edits, each again redrawing every card and all eight charts: 410 V and 425 V differ in
    // every chart (the switch rating and the parts chosen change between them), a 1 V step may not.
    const later: number[] = [];
    for (const text of ['410 V', '425 V', '410 V', '425 V', '410 V', '425 V']) {
      await page.evaluate(() => { window.__resetwiseUpdates = []; });
      await vinMax.fill(text);
      await expect.poll(async () => (await switchPeaks(page))['two-switch']).toBe(text);
      await expect.poll(async () => (await editTiming(page)).charts.length).toBe(CHARTS.length);
      later.push((await editTiming(page)).slowestMs);
    }
    console.log(`Compare: later edits → every card and chart updated in ${later.map((ms) => ms.toFixed(1)).join(', ')} ms (median ${median(later).toFixed(1)} ms)`);
    expect(Math.max(...later)).toBeLessThan(500); // generous bound, as above

    // A chart whose data an edit leaves unchanged is not redrawn: the sweeps run from Vin,min to Vin,max
    // and do not use Vin,nom (derived), while the losses and waveforms are taken at Vin,nom.
    const stressBefore = await stressChartPixels(page);
    const lossBefore = await chartPixels(page, 'losses');
    await page.evaluate(() => { window.__resetwiseUpdates = []; });
    await page.getByLabel('Input nominal').fill('395 V');
    await expect.poll(() => chartPixels(page, 'losses')).not.toBe(lossBefore);
    const nominal = await editTiming(page);
    expect(nominal.charts).toContain('losses');
    expect(nominal.charts).toContain('waveform-drain');
    expect(nominal.charts).not.toContain('switch-stress');
    expect(nominal.charts).not.toContain('duty');
    expect(await stressChartPixels(page)).toBe(stressBefore);
    console.log(`Compare: Vin,nom edit → ${nominal.charts.length} of ${CHARTS.length} charts redrawn (${nominal.charts.join(', ')}), done in ${nominal.slowestMs.toFixed(1)} ms`);
    await page.locator('[data-charts]').screenshot({ path: path.join(SCREENSHOT_DIR, 'compare-architect-charts.png') });

    await expect.poll(() => page.locator('[data-save-state]').getAttribute('data-save-state')).toBe('unsaved');
    await page.getByRole('button', { name: 'Save', exact: true }).click();
    await expect.poll(() => page.locator('[data-save-state]').getAttribute('data-save-state')).toBe('saved');
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'compare-architect-saved.png'), fullPage: true });
    await page.reload();
    await expect.poll(() => page.getByLabel('Input maximum').inputValue()).toBe('425 V');
    await page.context().close();
  });

  it('architect: a bad field keeps the last valid result, greyed, with a note', async () => {
    const page = await signedInPage('architect@resetwise.example');
    await page.getByRole('link', { name: /Brick 36–75 V/ }).click();
    await page.locator('[data-scheme-card="two-switch"]').waitFor();
    const peak = await page.locator('[data-scheme-card="two-switch"] [data-figure="Switch peak (steady)"]').textContent();
    await page.getByLabel('Switching frequency').fill('200 kV');
    await page.locator('[data-field-note="fswHz"]').getByText(/not a unit of Hz/).waitFor();
    await page.getByText('Showing the last valid result while the form has errors.').waitFor();
    expect(await page.locator('[data-cards]').getAttribute('data-current')).toBe('false');
    expect(await page.locator('[data-scheme-card="two-switch"] [data-figure="Switch peak (steady)"]').textContent()).toBe(peak);
    expect(await page.getByRole('button', { name: 'Save', exact: true }).isDisabled()).toBe(true);
    await page.getByLabel('Input minimum').fill('90');
    await page.getByLabel('Switching frequency').fill('250k');
    await page.locator('[data-field-note="vinMinV"]').getByText('vinMinV (90) must not exceed vinMaxV (75)').waitFor();
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'compare-invalid.png'), fullPage: true });
    await page.context().close();
  });

  it('a formula, its inputs and its source show on focus', async () => {
    const page = await signedInPage('engineer@resetwise.example');
    await page.getByRole('link', { name: /Brick 36–75 V/ }).click();
    const card = page.locator('[data-scheme-card="active-clamp"]');
    await card.waitFor();
    await card.locator('[data-figure="Switch peak (steady)"] button').focus();
    await expect.poll(() => card.locator('[data-trace]').textContent()).toMatch(/Source:/);
    await page.context().close();
  });

  it('sales: tries values on a saved set (typed, every card follows), with no save and no sweep', async () => {
    const page = await signedInPage('sales@resetwise.example');
    expect(await page.getByRole('navigation', { name: 'Screens' }).getByRole('link', { name: 'Sweep' }).count()).toBe(0);
    await page.getByRole('link', { name: /24 V rail to 5 V/ }).click();
    await page.locator('[data-scheme-card="two-switch"]').waitFor();
    const vinMax = page.getByLabel('Input maximum');
    expect(await vinMax.getAttribute('readonly')).toBeNull();
    const before = await switchPeaks(page);
    await vinMax.click();
    await vinMax.press('Control+A');
    await vinMax.pressSequentially('40 V');
    await expect.poll(async () => (await switchPeaks(page))['two-switch']).toBe('40 V');
    expect((await switchPeaks(page))['two-switch']).not.toBe(before['two-switch']);
    expect(await page.getByRole('button', { name: 'Save', exact: true }).count()).toBe(0);
    await page.getByText('You can try values here; only architects and admins save requirement sets.').waitFor();
    await expect.poll(() => page.locator('[data-save-state]').textContent()).toMatch(/^Trying values · saved version \d+ unchanged$/);
    await page.screenshot({ path: path.join(SCREENSHOT_DIR, 'compare-sales.png'), fullPage: true });
    await page.locator('[data-charts]').scrollIntoViewIfNeeded();
    for (const name of CHARTS) await page.locator(`[data-chart="${name}"] canvas`).waitFor();
    await page.locator('[data-charts]').screenshot({ path: path.join(SCREENSHOT_DIR, 'compare-sales-charts.png') });
    expect((await page.goto(`${server.url}/compare`))?.status()).toBe(200);
    expect((await page.goto(`${server.url}/sweep`))?.status()).toBe(403);
    await page.context().close();
  });
});
