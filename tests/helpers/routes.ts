import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';

export interface Route {
  /** e.g. `GET /api/v1/specs/[id]` — the key of the access table. */
  key: string;
  method: string;
  pattern: string;
  file: string;
}

const PAGES = path.resolve('src/pages');

/** Every page and endpoint under src/pages with its HTTP methods (pages answer GET). */
export function listRoutes(): Route[] {
  const files = readdirSync(PAGES, { recursive: true, encoding: 'utf8' }).filter((f) => /\.(astro|ts)$/.test(f));
  const routes: Route[] = [];
  for (const file of files) {
    let pattern = `/${file.replace(/\\/g, '/').replace(/\.(astro|ts)$/, '')}`.replace(/\/index$/, '');
    if (pattern === '') pattern = '/';
    const methods = file.endsWith('.astro')
      ? ['GET']
      : [...readFileSync(path.join(PAGES, file), 'utf8').matchAll(/export const (GET|POST|PUT|PATCH|DELETE)\b/g)].map((m) => m[1]!);
    for (const method of methods) routes.push({ key: `${method} ${pattern}`, method, pattern, file });
  }
  return routes.sort((a, b) => a.key.localeCompare(b.key));
}
