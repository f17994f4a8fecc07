import { describe, expect, it } from 'vitest';
import { safeNext } from '../../src/lib/next-path';

// Issue 16: the one check of `next` after sign-in (page, API and form), as a browser would resolve it.
const ORIGIN = 'http://localhost:4321';

describe('safeNext', () => {
  it.each([
    ['/compare/demo-spec-1', '/compare/demo-spec-1'],
    ['/compare/demo-spec-1?vin=max#card', '/compare/demo-spec-1?vin=max#card'],
    ['/specs/../team', '/team'],
    ['/a b', '/a%20b'],
    ['/%2F%2Fevil.example', '/%2F%2Fevil.example'],
  ])('%s stays: %s', (next, path) => {
    expect(safeNext(next, ORIGIN)).toBe(path);
  });

  it.each([
    '//evil.example', '/\\evil.example', '/\t/evil.example', '/\n/evil.example', '/\r\n/evil.example', '\t//evil.example',
    'https://evil.example/', 'javascript:alert(1)', ' /specs', '', 'specs', '/\\/evil.example', '/\t\\evil.example',
  ])('%j goes home', (next) => {
    expect(safeNext(next, ORIGIN)).toBe('/');
  });

  it('anything but text goes home', () => {
    expect(safeNext(undefined, ORIGIN)).toBe('/');
    expect(safeNext(['/specs'], ORIGIN)).toBe('/');
    expect(safeNext(null, ORIGIN)).toBe('/');
  });
});
