import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Browser, Page } from 'playwright-core';
import { getDocument } from 'pdfjs-dist/legacy/build/pdf.mjs';
import { startServer, type RunningServer } from '../helpers/server';
import { islandsHydrated, launchBrowser, SCREENSHOT_DIR, signInThroughForm } from '../helpers/browser';

let server: RunningServer;
let browser: Browser;
const PDF_DIR = path.resolve('test-output/pdf');
beforeAll(async () => {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  mkdirSync(PDF_DIR, { recursive: true });
  [server, browser] = await Promise.all([startServer(), launchBrowser()]);
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

const signedInPage = (email: string): Promise<Page> => signInThroughForm(browser, server.url, email);

/** Page count and the text of a PDF (whitespace collapsed), read with pdf.js. */
async function pdfText(pdf: Buffer): Promise<{ pages: number; text: string }> {
  const doc = await getDocument({ data: new Uint8Array(pdf), useSystemFonts: false }).promise;
  let text = '';
  for (let i = 1; i <= doc.numPages; i++) {
    const content = await (await doc.getPage(i)).getTextContent();
    for (const item of content.items) if ('str' in item) text += item.str + (item.hasEOL ? '\n' : '');
    text += '\n';
  }
  const pages = doc.numPages;
  await doc.destroy();
  return { pages, text: text.replace(/\s+/g, ' ') };
}

interface BriefApi {
  versions: { version: number; content: { customerName: string; requirements: { label: string; value: string }[]; recommended: { label: string; figures: { label: string; value: string }[] }; cost: { low: number; high: number; currency: string } } }[];
}

describe('Briefs in the browser', () => {
  it('sales writes a brief from Compare, sends it, and the link opens signed out and prints cleanly', async () => {
    const sales = await signedInPage('sales@resetwise.example');
    await sales.goto(`${server.url}/compare/demo-spec-1`);
    await sales.locator('[data-write-brief]').waitFor();
    await sales.screenshot({ path: path.join(SCREENSHOT_DIR, 'compare-write-brief-sales.png'), clip: { x: 0, y: 0, width: 1280, height: 260 } });
    await sales.locator('[data-write-brief]').click();
    await sales.waitForURL((url) => url.pathname === '/briefs' && url.searchParams.get('specId') === 'demo-spec-1');
    await islandsHydrated(sales);
    await sales.screenshot({ path: path.join(SCREENSHOT_DIR, 'briefs-list-sales.png'), fullPage: true });
    await sales.getByLabel('Contact').fill('Jana Holm, jana.holm@nordlicht.example');
    await sales.getByRole('button', { name: 'Create brief' }).click();
    await sales.waitForURL((url) => /^\/briefs\/[\w-]+$/.test(url.pathname));
    await islandsHydrated(sales);
    const briefId = new URL(sales.url()).pathname.split('/').pop()!;

    // Edit: a wider contingency; the document's cost band follows after saving.
    await sales.getByLabel('Contingency above, %').fill('30');
    await sales.getByRole('button', { name: 'Save draft' }).click();
    await expect.poll(() => sales.locator('[data-cost-band]').textContent()).toMatch(/EUR per unit/);
    await expect.poll(() => sales.getByText('−10 % / +30 %').count()).toBe(1);
    await sales.screenshot({ path: path.join(SCREENSHOT_DIR, 'brief-editor-sales.png'), fullPage: true });

    // Send: one captured message, a frozen version and its link.
    await sales.getByLabel('To', { exact: true }).fill('jana.holm@nordlicht.example');
    await sales.getByRole('button', { name: 'Send brief' }).click();
    const url = (await sales.locator('[data-share-url]').textContent())!.trim();
    // The link's origin is the configured one (here the server's host and port), never the request's Host.
    expect(url).toMatch(new RegExp(`^http://localhost:${server.port}/share/[A-Za-z0-9_-]{43}$`));
    await sales.locator('[data-version="1"]').waitFor();
    await sales.screenshot({ path: path.join(SCREENSHOT_DIR, 'brief-sent-sales.png'), fullPage: true });
    const brief = (await (await sales.request.get(`${server.url}/api/v1/briefs/${briefId}`)).json()) as BriefApi;
    const content = brief.versions[0]!.content;

    // A fresh, signed-out browser context opens the link.
    const outsider = await browser.newContext({ viewport: { width: 1280, height: 900 } });
    const reader = await outsider.newPage();
    const response = await reader.goto(url);
    expect(response?.status()).toBe(200);
    await reader.locator('[data-brief-document]').waitFor();
    expect(await reader.locator('nav').count()).toBe(0);
    expect(await reader.locator('a').count()).toBe(0);
    expect(await reader.locator('script').count()).toBe(0);
    expect(await reader.locator('[data-brief-customer]').textContent()).toBe('Nordlicht Telecom (fictional)');
    await reader.screenshot({ path: path.join(SCREENSHOT_DIR, 'brief-share-signed-out.png'), fullPage: true });

    // Print to PDF on A4 and Letter: a short document with the key figures in its text.
    const money = (x: number) => `${x.toFixed(2)} ${content.cost.currency}`;
    const keyFigures = [
      'Nordlicht Telecom (fictional)',
      '36–75 V DC, nominal 48 V',
      '250 kHz',
      '12 V at 12.5 A (150 W)',
      `Recommendation: ${content.recommended.label}`,
      `${money(content.cost.low)} – ${money(content.cost.high)} per unit`,
      '20,000 units/year',
      content.recommended.figures.find((f) => f.label === 'Worst-case switch stress')!.value,
      content.recommended.figures.find((f) => f.label.startsWith('Efficiency'))!.value,
      'Early estimate, not a design',
      'Power-stage BOM only, not a quote',
      'hazardous voltages',
      'IEC 62368-1',
    ];
    for (const format of ['A4', 'Letter'] as const) {
      await reader.emulateMedia({ media: 'print' });
      const pdf = await reader.pdf({ format, printBackground: true, preferCSSPageSize: true });
      writeFileSync(path.join(PDF_DIR, `brief-${format}.pdf`), pdf);
      const { pages, text } = await pdfText(pdf);
      console.log(`brief PDF (${format}): ${pages} pages, ${pdf.length} bytes`);
      expect(pages).toBeGreaterThanOrEqual(2);
      expect(pages).toBeLessThanOrEqual(4);
      for (const figure of keyFigures) expect(text, `${format} PDF text`).toContain(figure);
      expect(text).toContain(`Page 1 of ${pages}`); // the @page footer of the print sheet
    }

    // Printing the editor page prints the document only, not the tools.
    await sales.emulateMedia({ media: 'print' });
    const editorPdf = await pdfText(await sales.pdf({ format: 'A4', printBackground: true }));
    expect(editorPdf.text).toContain('Nordlicht Telecom (fictional)');
    expect(editorPdf.text).not.toContain('Save draft');
    expect(editorPdf.text).not.toContain('Send to the customer');
    expect(editorPdf.text).not.toContain('Sign out');

    // Revoking ends the link for the reader.
    await sales.emulateMedia({ media: 'screen' });
    sales.once('dialog', (dialog) => void dialog.accept());
    await sales.locator('[data-revoke-all]').click();
    await expect.poll(async () => (await reader.goto(url))?.status()).toBe(410);
    await reader.getByText('withdrawn').waitFor();
    await outsider.close();

    // Engineers read the brief but have no editor, send or share tools.
    const engineer = await signedInPage('engineer@resetwise.example');
    await engineer.goto(`${server.url}/briefs/${briefId}`);
    await islandsHydrated(engineer);
    await engineer.locator('[data-read-only]').waitFor();
    expect(await engineer.locator('[data-send-form]').count()).toBe(0);
    expect(await engineer.locator('[data-share-panel]').count()).toBe(0);
    await engineer.locator('[data-version="1"] button').click();
    await engineer.locator('[data-brief-document][data-brief-issue="1"]').waitFor();
    await engineer.screenshot({ path: path.join(SCREENSHOT_DIR, 'brief-engineer-read-only.png'), fullPage: true });
    await engineer.goto(`${server.url}/briefs`);
    await engineer.screenshot({ path: path.join(SCREENSHOT_DIR, 'briefs-list-engineer.png'), fullPage: true });
    await engineer.context().close();
    await sales.context().close();
  }, 120_000);
});
