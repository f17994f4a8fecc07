import { describe, expect, test } from 'vitest';
import { designScheme } from '../../../src/engine/design/pipeline';
import { newDesign, resetDesign } from '../../../src/engine/design/record';
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
  test('the spec view copies every field of a normalised spec with the same values', () => {
    const s = spec({ ...TELECOM, targetEfficiency: 0.9, weights: { stress: 1, dutyHeadroom: 0, partCount: 0, cost: 2, efficiency: 0 } });
    const v = copySpec(newSpecView(), s);
    expect(Object.keys(v).sort()).toEqual(Object.keys(s).sort());
    expect(v).toEqual(s);
  });
});
