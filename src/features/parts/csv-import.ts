import Papa from 'papaparse';
import type { PartCategory, PartsLibrary } from '../../engine/parts/types';
import { FORMULA_START, partSchemaOf } from '../../schemas/parts';
import { CATEGORY_KEYS, categoryInfo } from './categories';
import { ALL_COLUMNS, TIER_COLUMNS } from './csv-format';
import { applyChanges, emptyCategoryProblems, fieldChanges, locatePart, type PartChange } from './changes';
import { MAX_TIERS } from './categories';

/** What an import would do, shown before anything changes. */
export interface ImportPreview {
  baseVersion: number;
  /** Data rows read (blank lines not counted). */
  rows: number;
  unchanged: number;
  changes: (PartChange & { line: number })[];
  /** Row-level problems with the file's line number; any one blocks the import. */
  errors: { line: number; id: string | null; message: string }[];
  /** Problems of the whole result (e.g. a category left empty). */
  problems: string[];
}

export type ImportParse = { ok: true; preview: ImportPreview } | { ok: false; message: string };

const NUMBER = /^[-+]?(?:\d+\.?\d*|\.\d+)(?:e[-+]?\d+)?$/i;

interface Row { line: number; cells: Record<string, string> }

/** Reads the rows with papaparse, keeping each row's first line number in the file. */
function readRows(text: string): { header: string[]; rows: Row[]; parseErrors: { line: number; message: string }[] } {
  const body = text.replace(/^\uFEFF/, '');
  const records: { cells: string[]; line: number }[] = [];
  const parseErrors: { line: number; message: string }[] = [];
  let line = 1;
  let offset = 0;
  Papa.parse<string[]>(body, {
    header: false,
    skipEmptyLines: false,
    step: (result) => {
      const start = line;
      const end = result.meta.cursor;
      for (let i = offset; i < end; i++) if (body.charCodeAt(i) === 10) line++;
      offset = end;
      for (const error of result.errors) parseErrors.push({ line: start, message: error.message });
      records.push({ cells: result.data, line: start });
    },
  });
  const first = records.findIndex((r) => r.cells.some((c) => c.trim() !== ''));
  if (first < 0) return { header: [], rows: [], parseErrors };
  const header = records[first]!.cells.map((c) => c.trim());
  const rows: Row[] = [];
  for (const record of records.slice(first + 1)) {
    if (record.cells.every((c) => c.trim() === '')) continue;
    const cells: Record<string, string> = {};
    header.forEach((name, i) => (cells[name] = (record.cells[i] ?? '').trim()));
    if (record.cells.length !== header.length) parseErrors.push({ line: record.line, message: `has ${record.cells.length} cells but the header has ${header.length}` });
    rows.push({ line: record.line, cells });
  }
  return { header, rows, parseErrors };
}

/** The header must name known columns, each once, including category and id. */
function headerProblem(header: string[]): string | null {
  if (header.length === 0) return 'The file is empty: the first line must be the header row (category, id, status, …).';
  if (!header.includes('category') || !header.includes('id')) {
    return `Wrong header: the first line must name the columns, including "category" and "id" (found: ${header.slice(0, 6).join(', ')}${header.length > 6 ? ', …' : ''}). Export the library to get a template.`;
  }
  const unknown = header.filter((h) => !ALL_COLUMNS.includes(h));
  if (unknown.length > 0) return `Wrong header: unknown column(s) ${unknown.map((u) => `"${u}"`).join(', ')}. Export the library to see the expected columns.`;
  const twice = header.filter((h, i) => header.indexOf(h) !== i);
  if (twice.length > 0) return `Wrong header: column(s) ${[...new Set(twice)].join(', ')} appear more than once.`;
  return null;
}

/** One row as a part of its category, or the reasons it is not one. */
function rowToPart(row: Row, category: PartCategory, currency: string): { part?: Record<string, unknown>; problems: string[] } {
  const info = categoryInfo(category)!;
  const problems: string[] = [];
  const own = new Set(info.fields.map((f) => f.key));
  for (const [column, value] of Object.entries(row.cells)) {
    if (value !== '' && FORMULA_START.test(value) && !NUMBER.test(value)) problems.push(`${column} "${value.slice(0, 20)}" starts like a spreadsheet formula (= + - @); not accepted`);
    else if (value !== '' && !own.has(column) && !TIER_COLUMNS.includes(column) && !['action', 'category', 'id', 'status', 'description', 'currency'].includes(column)) {
      problems.push(`${column} does not apply to a ${info.singular}; leave it empty`);
    }
  }
  if (row.cells.currency && row.cells.currency !== currency) problems.push(`currency ${row.cells.currency} differs from the library's ${currency}; convert the prices first`);
  const part: Record<string, unknown> = { id: row.cells.id ?? '', status: row.cells.status ?? '' };
  if (row.cells.description) part.description = row.cells.description;
  for (const field of info.fields) {
    const text = row.cells[field.key] ?? '';
    if (text === '') problems.push(`${field.key} is missing`);
    else if (field.kind !== 'number') part[field.key] = text;
    else if (!NUMBER.test(text)) problems.push(`${field.key} "${text.slice(0, 20)}" is not a number (plain number in ${field.unit || 'no unit'}, e.g. 1.5e-9)`);
    else part[field.key] = Number(text);
  }
  const tiers: { minQty: number; unitPrice: number }[] = [];
  for (let i = 1; i <= MAX_TIERS; i++) {
    const qty = row.cells[`tier${i}Qty`] ?? '';
    const price = row.cells[`tier${i}Price`] ?? '';
    if (qty === '' && price === '') continue;
    if (qty === '' || price === '') { problems.push(`tier ${i} needs both a quantity and a price`); continue; }
    if (!NUMBER.test(qty) || !NUMBER.test(price)) { problems.push(`tier ${i} quantity and price must be numbers`); continue; }
    tiers.push({ minQty: Number(qty), unitPrice: Number(price) });
  }
  part.tiers = tiers;
  if (problems.length > 0) return { problems };
  const parsed = partSchemaOf(category).safeParse(part);
  if (!parsed.success) return { problems: parsed.error.issues.map((i) => i.message) };
  return { part: parsed.data, problems };
}

/** Parses an import file against the current library into a preview; nothing is written here. */
export function previewImport(text: string, library: PartsLibrary, baseVersion: number): ImportParse {
  const { header, rows, parseErrors } = readRows(text);
  const headerIssue = headerProblem(header);
  if (headerIssue) return { ok: false, message: headerIssue };
  if (rows.length === 0) return { ok: false, message: 'The file has a header but no rows of parts.' };
  const preview: ImportPreview = { baseVersion, rows: rows.length, unchanged: 0, changes: [], errors: parseErrors.map((e) => ({ ...e, id: null })), problems: [] };
  const seen = new Map<string, number>();
  for (const row of rows) {
    const id = row.cells.id || null;
    const fail = (message: string): void => void preview.errors.push({ line: row.line, id, message });
    const category = row.cells.category ?? '';
    if (!(CATEGORY_KEYS as string[]).includes(category)) { fail(`unknown category "${category.slice(0, 30)}"; use one of ${CATEGORY_KEYS.join(', ')}`); continue; }
    if (id && seen.has(id)) { fail(`id ${id} appears again (first on line ${seen.get(id)}); each part once`); continue; }
    if (id) seen.set(id, row.line);
    const action = (row.cells.action ?? '').toLowerCase();
    const existing = id ? locatePart(library, id) : undefined;
    const cat = category as PartCategory;
    if (action !== '' && action !== 'retire') { fail(`action "${action.slice(0, 20)}" is not understood; leave it empty to add or change, or write retire`); continue; }
    if (action === 'retire') {
      if (!existing || existing.category !== cat) fail(`id ${id ?? '(empty)'} is not a ${categoryInfo(cat)!.singular} in the library, so it cannot be retired`);
      else preview.changes.push({ op: 'retire', category: cat, id: existing.part.id, line: row.line });
      continue;
    }
    const { part, problems } = rowToPart(row, cat, library.currency);
    if (!part) { for (const p of problems) fail(p); continue; }
    if (existing && existing.category !== cat) { fail(`id ${part.id} is already a ${categoryInfo(existing.category)!.singular} in the library; ids are unique across categories`); continue; }
    if (!existing) { preview.changes.push({ op: 'add', category: cat, id: part.id as string, part, line: row.line }); continue; }
    const fields = fieldChanges(existing.part, part);
    if (Object.keys(fields).length === 0) preview.unchanged++;
    else preview.changes.push({ op: 'change', category: cat, id: part.id as string, fields, part, line: row.line });
  }
  preview.errors.sort((a, b) => a.line - b.line);
  if (preview.errors.length === 0) preview.problems = emptyCategoryProblems(applyChanges(library, preview.changes));
  return { ok: true, preview };
}
