import { describe, expect, it } from 'vitest';
import { sameData } from '../../src/features/compare/charts/stable';

// The charts skip Chart.js updates when their inputs are structurally equal, so equality must
// never call two different inputs the same (a chart would keep showing the old result).
describe('sameData (chart inputs unchanged by an edit)', () => {
  const f = () => 1;
  it.each([
    ['equal numbers', 1, 1, true],
    ['different numbers', 1, 1.0000001, false],
    ['NaN equals NaN (an undefined figure stays undefined)', NaN, NaN, true],
    ['0 and −0 differ', 0, -0, false],
    ['strings', 'Two-switch', 'Two-switch', true],
    ['number and its text', 1, '1', false],
    ['null and undefined', null, undefined, false],
    ['equal point lists', [{ x: 300, y: 600 }, { x: 410, y: 820 }], [{ x: 300, y: 600 }, { x: 410, y: 820 }], true],
    ['one point moved', [{ x: 300, y: 600 }, { x: 410, y: 820 }], [{ x: 300, y: 600 }, { x: 410, y: 821 }], false],
    ['one point more', [{ x: 300, y: 600 }], [{ x: 300, y: 600 }, { x: 410, y: 820 }], false],
    ['array and object with the same keys', [1, 2], { 0: 1, 1: 2 }, false],
    ['a key missing', { a: 1, b: undefined }, { a: 1, c: undefined }, false],
    ['nested dash arrays', { borderDash: [1, 3], label: 'limit' }, { borderDash: [1, 3], label: 'limit' }, true],
    ['nested dash arrays differ', { borderDash: [1, 3] }, { borderDash: [3, 1] }, false],
    ['the same function', { callback: f }, { callback: f }, true],
    ['two functions with the same body', { callback: () => 1 }, { callback: () => 1 }, false],
  ])('%s', (_name, a, b, same) => {
    expect(sameData(a, b)).toBe(same);
    expect(sameData(b, a)).toBe(same);
  });
});
