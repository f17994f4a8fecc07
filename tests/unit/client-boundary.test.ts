import { existsSync, readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, test } from 'vitest';
import { HAZARDOUS_ABOVE_V, isHazardous } from '../../src/lib/safety';

/**
 * The server/client boundary, enforced: nothing a browser loads — an island (every .tsx file), a store, the Sweep worker
 * and all they import — may import a `*.server.ts` module, the database layer (`src/db/`) or `src/lib/server/`.
 * Type-only imports are erased by the compiler and do not count.
 */
const files = (d: string): string[] => readdirSync(d).flatMap((n) => {
  const p = path.join(d, n);
  return statSync(p).isDirectory() ? files(p) : [p.split(path.sep).join('/')];
});

function resolve(from: string, spec: string): string | null {
  const base = spec.startsWith('@/') ? `src/${spec.slice(2)}` : spec.startsWith('.') ? path.posix.join(path.posix.dirname(from), spec) : null;
  if (!base) return null;
  for (const ext of ['', '.ts', '.tsx', '.mjs', '.js', '/index.ts', '/index.tsx']) {
    if (existsSync(base + ext) && statSync(base + ext).isFile()) return base + ext;
  }
  return null;
}

const forbidden = (f: string): boolean => /\.server\.tsx?$/.test(f) || f.startsWith('src/db/') || f.startsWith('src/lib/server/');

/** Every chain from a client root to a forbidden module, as "a -> b -> c". */
function violations(roots: string[]): string[] {
  const out: string[] = [];
  for (const root of roots) {
    const seen = new Set<string>();
    const stack: string[][] = [[root]];
    while (stack.length > 0) {
      const trail = stack.pop()!;
      const file = trail.at(-1)!;
      if (seen.has(file)) continue;
      seen.add(file);
      const text = readFileSync(file, 'utf8');
      for (const m of text.matchAll(/(?:^|\n)\s*(import|export)\s+(type\s+)?(?:[^'"]*?\sfrom\s+)?['"]([^'"]+)['"]/g)) {
        if (m[2]) continue;
        const target = resolve(file, m[3]!);
        if (!target) continue;
        if (forbidden(target)) out.push([...trail, target].join(' -> '));
        else stack.push([...trail, target]);
      }
    }
  }
  return out;
}

describe('what the browser loads never reaches server code', () => {
  const all = files('src');
  const roots = all.filter((f) => f.endsWith('.tsx') || f.startsWith('src/stores/') || f.endsWith('.worker.ts'));
  test('no island, store or worker imports *.server.ts, src/db/ or src/lib/server/, however indirectly', () => {
    expect(roots.length).toBeGreaterThan(40);
    expect(violations(roots)).toEqual([]);
  });
  test('the walk finds such an import when there is one', () => {
    const server = all.find((f) => f.endsWith('.server.ts'))!;
    // A client module that imports a module which imports server code: the walk reports the whole chain.
    const importer = all.find((f) => !forbidden(f) && /\.tsx?$/.test(f) && readFileSync(f, 'utf8').includes(`/${path.posix.basename(server, '.ts')}'`));
    expect(importer, `some module imports ${server}`).toBeDefined();
    expect(violations([importer!]).some((v) => v.endsWith(server))).toBe(true);
  });
});

describe('one threshold for the safety caution', () => {
  test('60 V dc: at 60 V no caution, above it the caution', () => {
    expect(HAZARDOUS_ABOVE_V).toBe(60);
    expect(isHazardous(60)).toBe(false);
    expect(isHazardous(60.1)).toBe(true);
  });
  test('no page, island or module compares a voltage with a bare 60', () => {
    const bare = /(?:[<>]=?|===?)\s*60\b(?!\s*\*)|\b60\s*(?:[<>]=?)/;
    const offenders = files('src').filter((f) => /\.(ts|tsx|astro)$/.test(f) && f !== 'src/lib/safety.ts' && bare.test(readFileSync(f, 'utf8')));
    expect(offenders).toEqual([]);
  });
});
