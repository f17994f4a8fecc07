import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, test } from 'vitest';

/**
 * Stored JSON is typed at the database: each jsonb column names the type its rows hold (the zod-inferred spec, the
 * engine's comparison and result, the library, the brief's draft and frozen content), so code that reads a row needs
 * no `as unknown as` to use it.
 */
const schema = readFileSync('src/db/schema.ts', 'utf8');
const files = (d: string): string[] => readdirSync(d).flatMap((n) => {
  const p = path.join(d, n);
  return statSync(p).isDirectory() ? files(p) : [p.split(path.sep).join('/')];
});

/** Free-form by design: an audit entry's details differ per action; the change list is written and read as a whole. */
const UNTYPED_ON_PURPOSE = new Set(['details', 'changes']);

describe('stored JSON is typed through the database', () => {
  const columns = [...schema.matchAll(/(\w+):\s*jsonb\('\w+'\)\.\$type<(.+?)>\(\)/g)].map((m) => ({ key: m[1]!, type: m[2]! }));

  test('every jsonb column has a type of its own', () => {
    expect(columns.length).toBeGreaterThanOrEqual(10);
    expect((schema.match(/jsonb\('/g) ?? []).length).toBe(columns.length);
    const loose = columns.filter((c) => /^Record<string, unknown>/.test(c.type) && !UNTYPED_ON_PURPOSE.has(c.key)).map((c) => c.key);
    expect(loose).toEqual([]);
  });

  test('no `as unknown as` on a value read from a stored column', () => {
    const stored = columns.filter((c) => !UNTYPED_ON_PURPOSE.has(c.key)).map((c) => c.key);
    const reads = new RegExp(`\\.(${stored.join('|')})\\b[^;]*\\bas unknown as\\b`);
    const offenders = files('src')
      .filter((f) => /\.(ts|tsx|astro)$/.test(f))
      .flatMap((f) => readFileSync(f, 'utf8').split('\n').map((line, i) => ({ where: `${f}:${i + 1}`, line })))
      .filter(({ line }) => reads.test(line))
      .map(({ where, line }) => `${where}: ${line.trim()}`);
    expect(offenders).toEqual([]);
  });
});
