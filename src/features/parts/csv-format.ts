import Papa from 'papaparse';
import { partsOf, type PartCategory, type PartsLibrary } from '../../engine/parts/types';
import { guardCell } from '../../lib/comparison-csv';
import { CATEGORIES, MAX_TIERS, categoryInfo } from './categories';

/**
 * The parts-library CSV: one row per part, SI units in plain numbers (the unit is in each column
 * name, as in the API), price tiers as tierNQty/tierNPrice pairs. `action` is empty on export;
 * an import reads an empty action as add-or-change and `retire` as "remove from the library".
 */

export const BASE_COLUMNS = ['action', 'category', 'id', 'status', 'description', 'currency'] as const;

export const TIER_COLUMNS: string[] = Array.from({ length: MAX_TIERS }, (_, i) => [`tier${i + 1}Qty`, `tier${i + 1}Price`]).flat();

/** Electrical columns of the given categories, each once, in category order. */
export function fieldColumns(categories: readonly PartCategory[]): string[] {
  const seen = new Set<string>();
  for (const key of categories) for (const field of categoryInfo(key)!.fields) seen.add(field.key);
  return [...seen];
}

/** Every column an import may carry. */
export const ALL_COLUMNS: string[] = [...BASE_COLUMNS, ...fieldColumns(CATEGORIES.map((c) => c.key)), ...TIER_COLUMNS];

/** A number as the shortest text that reads back to the same double (no rounding on export). */
function numberCell(value: number): string {
  return String(value);
}

function cell(value: unknown): string {
  if (typeof value === 'number') return numberCell(value);
  return guardCell(value);
}

/** The library (or one category of it) as CSV text. */
export function libraryCsv(library: PartsLibrary, category?: PartCategory): string {
  const categories = category ? [category] : CATEGORIES.map((c) => c.key);
  const fields = fieldColumns(categories);
  const header = [...BASE_COLUMNS, ...fields, ...TIER_COLUMNS];
  const rows: string[][] = [];
  for (const key of categories) {
    const info = categoryInfo(key)!;
    const own = new Set(info.fields.map((f) => f.key));
    for (const part of partsOf(library, key)) {
      const tiers = (part.tiers as { minQty: number; unitPrice: number }[]).flatMap((t) => [cell(t.minQty), cell(t.unitPrice)]);
      rows.push([
        '', key, cell(part.id), cell(part.status), cell(part.description ?? ''), cell(library.currency),
        ...fields.map((f) => (own.has(f) ? cell(part[f]) : '')),
        ...TIER_COLUMNS.map((_, i) => tiers[i] ?? ''),
      ]);
    }
  }
  return `${Papa.unparse({ fields: header, data: rows }, { newline: '\n' })}\n`;
}

/** File name for an export: `parts-library-v7.csv`, `parts-library-v7-mosfets.csv`. */
export function exportFileName(version: number, category?: PartCategory): string {
  return `parts-library-v${version}${category ? `-${category}` : ''}.csv`;
}
