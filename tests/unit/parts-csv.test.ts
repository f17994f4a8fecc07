import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { evaluate, demoPartsLibrary, unitPriceAt, type PartsLibrary } from '../../src/engine';
import { libraryCsv } from '../../src/features/parts/csv-format';
import { previewImport } from '../../src/features/parts/csv-import';
import { applyChanges } from '../../src/features/parts/changes';
import { parseStoredLibrary } from '../../src/schemas/parts';
import { seedLibraryJson } from '../../src/features/parts/seed-library';

const library: PartsLibrary = parseStoredLibrary(seedLibraryJson(), 1);
const partCount = Object.values(library).filter(Array.isArray).reduce((n, list) => n + list.length, 0);
const csv = libraryCsv(library);
const lines = csv.trimEnd().split('\n');
const header = lines[0]!;
const preview = (text: string) => {
  const parsed = previewImport(text, library, 1);
  if (!parsed.ok) throw new Error(parsed.message);
  return parsed.preview;
};
const fileError = (text: string): string => {
  const parsed = previewImport(text, library, 1);
  if (parsed.ok) throw new Error('expected the file to be refused');
  return parsed.message;
};
/** The exported row of one part, with a cell replaced. */
const rowOf = (id: string, column?: string, value?: string): string => {
  const line = lines.find((l) => l.split(',')[2] === id)!;
  if (!column) return line;
  const cells = line.split(',');
  cells[header.split(',').indexOf(column)] = value!;
  return cells.join(',');
};

describe('parts CSV round trip', () => {
  it('the stored demo library parses and keeps every part of the engine library', () => {
    expect(partCount).toBe(Object.values(demoPartsLibrary).filter(Array.isArray).reduce((n, list) => n + list.length, 0));
    expect(library.version).toBe('1');
  });

  it('export → import gives no changes (every number read back exactly)', () => {
    const p = preview(csv);
    expect(p.errors).toEqual([]);
    expect(p.changes).toEqual([]);
    expect(p.rows).toBe(partCount);
    expect(p.unchanged).toBe(partCount);
  });

  it('one category exported alone also imports without changes', () => {
    const p = preview(libraryCsv(library, 'cores'));
    expect(p.changes).toEqual([]);
    expect(p.unchanged).toBe(library.cores.length);
  });
});

describe('parts CSV import preview', () => {
  it('lists an added, a changed and a retired part with their line numbers', () => {
    const added = rowOf('demo-nmos-100v-a').replace('demo-nmos-100v-a', 'halvard-nmos-100v-x');
    const changed = rowOf('demo-nmos-150v-a', 'tier3Price', '0.7');
    const retired = `retire${rowOf('demo-cap-film-0p1uf-1000v')}`;
    const p = preview([header, added, changed, retired].join('\n'));
    expect(p.errors).toEqual([]);
    expect(p.changes.map((c) => [c.op, c.id, c.line])).toEqual([
      ['add', 'halvard-nmos-100v-x', 2], ['change', 'demo-nmos-150v-a', 3], ['retire', 'demo-cap-film-0p1uf-1000v', 4],
    ]);
    expect(p.changes[1]!.fields!.tiers).toBeDefined();
  });

  it.each([
    ['unknown category', rowOf('demo-nmos-100v-a').replace(',mosfets,', ',thyristors,'), /unknown category "thyristors"/],
    ['non-numeric field', rowOf('demo-nmos-100v-a', 'vdsV', 'hundred'), /vdsV "hundred" is not a number/],
    ['missing field', rowOf('demo-nmos-100v-a', 'rdsOnOhm', ''), /rdsOnOhm is missing/],
    ['negative price', rowOf('demo-nmos-100v-a', 'tier2Price', '-0.4'), /unit price must not be negative/],
    ['formula in a text cell', rowOf('demo-nmos-100v-a', 'description', '=HYPERLINK("x")'), /starts like a spreadsheet formula/],
    ['formula in a number cell', rowOf('demo-nmos-100v-a', 'vdsV', '@SUM(A1)'), /starts like a spreadsheet formula/],
    ['field of another category', rowOf('demo-nmos-100v-a', 'capacitanceF', '1e-6'), /capacitanceF does not apply to a MOSFET/],
    ['unknown status', rowOf('demo-nmos-100v-a', 'status', 'obsolete'), /status must be preferred, allowed or nfnd/],
    ['foreign currency', rowOf('demo-nmos-100v-a', 'currency', 'USD'), /currency USD differs from the library's EUR/],
  ])('refuses a row with %s, naming its line', (_what, row, message) => {
    const p = preview([header, rowOf('demo-nmos-150v-a'), row].join('\n'));
    expect(p.errors.length).toBeGreaterThan(0);
    expect(p.errors[0]!.line).toBe(3);
    expect(p.errors.map((e) => e.message).join('\n')).toMatch(message);
  });

  it('refuses a duplicate id, pointing at the first line', () => {
    const p = preview([header, rowOf('demo-nmos-150v-a'), rowOf('demo-nmos-150v-a')].join('\n'));
    expect(p.errors).toEqual([{ line: 3, id: 'demo-nmos-150v-a', message: 'id demo-nmos-150v-a appears again (first on line 2); each part once' }]);
  });

  it('counts lines across quoted cells that hold line breaks', () => {
    const multi = rowOf('demo-nmos-150v-a', 'description', '"two\nlines"');
    const bad = rowOf('demo-nmos-100v-a', 'vdsV', 'x');
    const p = preview([header, multi, bad].join('\n'));
    expect(p.errors[0]!.line).toBe(4);
  });

  it.each([
    ['a header that is not ours', 'part,voltage\nx,1\n', /Wrong header/],
    ['an unknown column', `${header},colour\n`, /unknown column\(s\) "colour"/],
    ['no rows', `${header}\n`, /no rows of parts/],
    ['nothing', '\n\n', /empty/],
  ])('refuses the whole file with %s', (_what, text, message) => {
    expect(fileError(text)).toMatch(message);
  });

  it('refuses to leave a category without a part the engine may choose', () => {
    const rows = library.gateDrivers.map((d) => `retire${rowOf(d.id)}`);
    const p = preview([header, ...rows].join('\n'));
    expect(p.errors).toEqual([]);
    expect(p.problems.join('\n')).toMatch(/Gate drivers would have no part left/);
  });
});

describe('a cheaper qualifying MOSFET', () => {
  // Derived: a part with the same ratings as the engine's choice at half the price qualifies
  // wherever the original did, so the cheapest-qualifying rule (DESIGN.md step 4) must take it.
  it('changes the engine choice and lowers the BOM cost by the price difference', () => {
    const spec = JSON.parse(readFileSync('examples/telecom-brick-36-75v-12v.json', 'utf8'));
    const before = evaluate(spec, library).results.find((r) => r.scheme === 'two-switch')!;
    const chosenId = before.details.mainSwitchId!;
    const chosen = library.mosfets.find((m) => m.id === chosenId)!;
    const cheaper = { ...chosen, id: 'halvard-nmos-cheap', tiers: chosen.tiers.map((t) => ({ ...t, unitPrice: t.unitPrice / 2 })) };
    const next = applyChanges(library, [{ op: 'add', category: 'mosfets', id: cheaper.id, part: cheaper }]);
    const after = evaluate(spec, next).results.find((r) => r.scheme === 'two-switch')!;
    expect(after.details.mainSwitchId).toBe('halvard-nmos-cheap');
    const qty = before.parts.filter((l) => l.partId === chosenId).reduce((n, l) => n + l.qty, 0);
    const saving = qty * (unitPriceAt(chosen.tiers, spec.annualVolume) - unitPriceAt(cheaper.tiers, spec.annualVolume));
    expect(saving).toBeGreaterThan(0);
    expect(after.bomCost).toBeCloseTo(before.bomCost - saving, 9);
  });
});

describe('parts CSV export', () => {
  it('guards text cells a spreadsheet would run as a formula (common practice, OWASP CSV injection)', () => {
    const tampered = { ...library, mosfets: [{ ...library.mosfets[0]!, description: '=HYPERLINK("http://x.example")' }, { ...library.mosfets[1]!, description: '@SUM(1)' }] };
    const out = libraryCsv(tampered, 'mosfets');
    expect(out).toContain(`"'=HYPERLINK(""http://x.example"")"`);
    expect(out).toContain("'@SUM(1)");
    expect(out).not.toMatch(/,=|,@/);
  });

  it('keeps full precision of computed values (AL of the cores)', () => {
    const out = libraryCsv(library, 'cores');
    expect(out).toContain(String(library.cores[0]!.alH));
  });
});

describe('libraries stored before windings were costed (issue 17)', () => {
  it('a stored version without a windings list reads as one with none; any other missing list is still an error', () => {
    const { windings: _w, ...older } = seedLibraryJson() as Record<string, unknown>;
    expect(parseStoredLibrary(older, 3).windings).toEqual([]);
    const { cores: _c, ...broken } = seedLibraryJson() as Record<string, unknown>;
    expect(() => parseStoredLibrary(broken, 3)).toThrow(/no cores list/);
  });
  it('the winding entry exports and imports as CSV like any other part', () => {
    expect(csv).toContain('windings,demo-winding-shop-a');
  });
});
