import { readdirSync, readFileSync, statSync } from 'node:fs';
import path from 'node:path';
import { describe, expect, test } from 'vitest';
import { SCHEME_IDS, SCHEME_LABELS } from '../../src/engine/scheme-ids';
import { SCHEME_REGISTRY } from '../../src/engine/registry';

/**
 * One scheme, one module: what differs between reset schemes lives in the scheme's own engine module
 * (src/engine/schemes/) and in the registries keyed by id (the engine's, the UI's colours and drawings). No other code
 * names a scheme, so a new scheme cannot be forgotten by a `switch` somewhere that falls back to a default.
 */
const ALLOWED = [
  'src/engine/schemes/', 'src/engine/registry.ts', 'src/engine/scheme-ids.ts',
  'src/lib/scheme-style.ts', 'src/features/compare/schematics/registry.ts',
];

function files(dir: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = path.join(dir, name);
    return statSync(p).isDirectory() ? files(p) : /\.(ts|tsx|astro|mjs)$/.test(name) ? [p] : [];
  });
}

/** Source without its comments (block and line), so prose that mentions a scheme does not count. */
function code(text: string): string {
  return text.replace(/\/\*[\s\S]*?\*\//g, '').replace(/(^|[^:'"`])\/\/.*$/gm, '$1');
}

describe('scheme ids live in the schemes folder and the registries only', () => {
  test('no other source file names a scheme id in code', () => {
    const pattern = new RegExp(`['"\`](${SCHEME_IDS.join('|')})['"\`]`);
    const offenders = files('src')
      .map((f) => f.split(path.sep).join('/'))
      .filter((f) => !ALLOWED.some((a) => f.startsWith(a)))
      .filter((f) => pattern.test(code(readFileSync(f, 'utf8'))));
    expect(offenders).toEqual([]);
  });
  test('the check would catch one (a scheme id in a switch)', () => {
    expect(new RegExp(`['"\`](${SCHEME_IDS.join('|')})['"\`]`).test(code("switch (d.scheme) { case 'two-switch': return 1; } // 'rcd-clamp'"))).toBe(true);
    expect(new RegExp(`['"\`](${SCHEME_IDS.join('|')})['"\`]`).test(code("/** 'rcd-clamp' in prose */ const x = 1; // 'two-switch'"))).toBe(false);
  });
  test('every id has its model, and the model writes its label from the one table', () => {
    for (const id of SCHEME_IDS) {
      expect(SCHEME_REGISTRY[id].id).toBe(id);
      expect(SCHEME_REGISTRY[id].label).toBe(SCHEME_LABELS[id]);
    }
  });
});
