import { describe, expect, test } from 'vitest';
import { designScheme } from '../../../src/engine/design/pipeline';
import { copyDesign, newDesign, resetDesign } from '../../../src/engine/design/record';
import { copySpec, newSpecView } from '../../../src/engine/design/spec-view';
import { indexLibrary } from '../../../src/engine/parts/index-library';
import { demoPartsLibrary } from '../../../src/engine/parts/demo-library';
import { SCHEME_IDS } from '../../../src/engine/scheme-ids';
import { INDUSTRIAL, spec, TELECOM } from './helpers';

const index = indexLibrary(demoPartsLibrary);

describe('reusable design record (allocation-free evaluation; derived)', () => {
  test.each(SCHEME_IDS)('resetDesign after a full %s design equals a new record field by field', (id) => {
    const a = spec(TELECOM);
    const b = spec({ ...INDUSTRIAL, overrides: { [id]: { turnsPrimary: 9 } } });
    const used = designScheme(a, id, index);
    expect(used.core).not.toBeNull();
    const reset = resetDesign(used, b, id, index);
    const fresh = newDesign(b, id, index);
    expect(Object.keys(reset)).toEqual(Object.keys(fresh));
    expect(reset).toEqual(fresh);
    expect(reset.ov).toEqual({ turnsPrimary: 9 });
  });
  test.each(SCHEME_IDS)('copyDesign of a full %s design into a used record equals it field by field, sharing no mutable part', (id) => {
    const from = designScheme(spec(TELECOM), id, index);
    const into = designScheme(spec({ ...INDUSTRIAL, overrides: { [id]: { turnsPrimary: 9 } } }), id, index);
    into.fails.push('no-core', 'no-rectifier');
    const copied = copyDesign(into, from);
    expect(Object.keys(copied)).toEqual(Object.keys(newDesign(from.spec, id, index)));
    expect(copied).toEqual(from);
    expect(copied.fails).not.toBe(from.fails);
    expect(copied.lossesW).not.toBe(from.lossesW);
  });
  test('copyDesign moves every field: a record with a distinct value in each arrives whole', () => {
    const from = newDesign(spec(TELECOM), 'rcd-clamp', index) as unknown as Record<string, unknown>;
    let k = 1;
    for (const key of Object.keys(from)) {
      if (key === 'fails') from[key] = ['no-core'];
      else if (key === 'lossesW') from[key] = Object.fromEntries(Object.keys(from[key] as object).map((l) => [l, k++]));
      else from[key] = { marker: k++ };
    }
    const into = copyDesign(newDesign(spec(INDUSTRIAL), 'tertiary-winding', index), from as unknown as Parameters<typeof copyDesign>[1]);
    expect(into).toEqual(from);
  });
  test('the spec view copies every field of a normalised spec with the same values', () => {
    const s = spec({ ...TELECOM, targetEfficiency: 0.9, weights: { stress: 1, dutyHeadroom: 0, partCount: 0, cost: 2, efficiency: 0 } });
    const v = copySpec(newSpecView(), s);
    expect(Object.keys(v).sort()).toEqual(Object.keys(s).sort());
    expect(v).toEqual(s);
  });
});
