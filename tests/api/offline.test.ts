import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
beforeAll(async () => {
  server = await startServer();
});
afterAll(async () => {
  await server?.stop();
});

/** URLs a page would fetch: src/href attributes, CSS url() and @import. */
function fetchedUrls(text: string): string[] {
  const attrs = [...text.matchAll(/\b(?:src|href|action|poster|srcset)\s*=\s*["']([^"']+)["']/gi)].map((m) => m[1]!);
  const css = [...text.matchAll(/url\(\s*["']?([^"')]+)["']?\s*\)/gi)].map((m) => m[1]!);
  const imports = [...text.matchAll(/@import\s+["']([^"']+)["']/gi)].map((m) => m[1]!);
  return [...attrs, ...css, ...imports];
}
const external = (url: string) => /^(https?:)?\/\//i.test(url.trim());

function filesUnder(dir: string, ext: string): string[] {
  return readdirSync(dir, { recursive: true, encoding: 'utf8' }).filter((f) => f.endsWith(ext)).map((f) => path.join(dir, f));
}

describe('no request leaves the machine', () => {
  it('built CSS references no external URL and ships Noto Sans itself', () => {
    const cssFiles = filesUnder('dist/client', '.css');
    expect(cssFiles.length).toBeGreaterThan(0);
    const css = cssFiles.map((f) => readFileSync(f, 'utf8')).join('\n');
    expect(fetchedUrls(css).filter(external)).toEqual([]);
    expect(css).toMatch(/font-family:\s*["']?Noto Sans/);
    expect(filesUnder('dist/client', '.woff2').some((f) => /noto-sans/.test(f))).toBe(true);
  });

  it.each(['/sign-in', '/', '/team', '/no-such-page'])('served HTML of %s references no external URL', async (route) => {
    const cookie = await signIn(server.url, 'admin@resetwise.example');
    const reply = await fetch(`${server.url}${route}`, { headers: { cookie } });
    const html = await reply.text();
    expect(html).toMatch(/<html/);
    expect(fetchedUrls(html).filter(external)).toEqual([]);
    expect(reply.headers.get('content-security-policy')).toMatch(/default-src 'self'/);
  });
});
