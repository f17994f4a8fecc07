import Papa from 'papaparse';
import { parseQuantity } from '../../lib/units';
import { NUMERIC_FIELDS } from '../../lib/spec-fields';
import type { FieldProblem } from '../../lib/server/http';
import { MAX_JSON_DEPTH, nestsDeeperThan } from '../../lib/text-guard';

/**
 * A customer's requirement set from a file: JSON (`{vinMinV: "36 V", …}` or
 * `{name, customer, requirements: {…}}`) or CSV (a header of API field names and one row, or two
 * columns `field,value`). Values may carry units ("48 V", "200 kHz", "30 %"); each numeric field
 * is read with the unit of the requirement form. The result still goes through the shared schema.
 */
export interface SpecFile {
  name?: string;
  customer?: string;
  requirements: Record<string, unknown>;
}

export type SpecFileParse = { ok: true; value: SpecFile } | { ok: false; message: string; fields?: FieldProblem[] };

const FIELD_OF = new Map(NUMERIC_FIELDS.map((f) => [f.key as string, f]));

/** Converts text values with units to SI numbers; errors are named `requirements.<field>`. */
export function withUnits(raw: Record<string, unknown>): { value: Record<string, unknown>; errors: FieldProblem[] } {
  const value: Record<string, unknown> = {};
  const errors: FieldProblem[] = [];
  for (const [key, entry] of Object.entries(raw)) {
    const field = FIELD_OF.get(key);
    if (typeof entry === 'string' && entry.trim() === '') continue;
    if (!field || typeof entry !== 'string') { value[key] = entry; continue; }
    const parsed = parseQuantity(entry, field.kind);
    if (parsed.ok) value[key] = field.kind === 'count' ? Math.round(parsed.value) : parsed.value;
    else errors.push({ field: `requirements.${key}`, message: `${key}: ${parsed.message}` });
  }
  return { value, errors };
}

const text = (v: unknown): string | undefined => (typeof v === 'string' && v.trim() !== '' ? v.trim() : undefined);

function fromRecord(record: Record<string, unknown>): SpecFileParse {
  const nested = record.requirements;
  const { name, customer, requirements: _r, ...flat } = record;
  const source = nested && typeof nested === 'object' && !Array.isArray(nested) ? (nested as Record<string, unknown>) : flat;
  if (nested !== undefined && source === flat) return { ok: false, message: 'requirements must be an object of requirement fields.' };
  const { value, errors } = withUnits(source);
  if (errors.length > 0) return { ok: false, message: 'Some fields are not valid.', fields: errors };
  return { ok: true, value: { name: text(name), customer: text(customer), requirements: value } };
}

function fromJson(body: string): SpecFileParse {
  // The schemas recurse: a file nested thousands deep would overflow the stack before any field is checked.
  if (nestsDeeperThan(body, MAX_JSON_DEPTH)) return { ok: false, message: `The file nests deeper than ${MAX_JSON_DEPTH} levels; a requirement set needs only a few.` };
  let raw: unknown;
  try {
    raw = JSON.parse(body.replace(/^\uFEFF/, ''));
  } catch {
    return { ok: false, message: 'The file is not valid JSON.' };
  }
  if (!raw || typeof raw !== 'object' || Array.isArray(raw)) return { ok: false, message: 'The JSON must be one object of requirement fields (e.g. {"vinMinV": "36 V", …}).' };
  return fromRecord(raw as Record<string, unknown>);
}

function fromCsv(body: string): SpecFileParse {
  const parsed = Papa.parse<string[]>(body.replace(/^\uFEFF/, ''), { header: false, skipEmptyLines: 'greedy' });
  const rows = parsed.data.map((r) => r.map((c) => c.trim()));
  if (rows.length < 2) return { ok: false, message: 'The CSV needs a header row of field names and one row of values (or two columns: field,value).' };
  const header = rows[0]!;
  const record: Record<string, unknown> = {};
  if (header.length === 2 && header[0]!.toLowerCase() === 'field' && header[1]!.toLowerCase() === 'value') {
    for (const [index, row] of rows.slice(1).entries()) {
      const [key, value] = row;
      if (!key) continue;
      if (key in record) return { ok: false, message: `Field ${key} appears twice (line ${index + 2}).` };
      record[key] = value ?? '';
    }
  } else {
    if (rows.length > 2) return { ok: false, message: `The CSV holds ${rows.length - 1} rows of values; import one requirement set per file.` };
    const twice = header.filter((h, i) => header.indexOf(h) !== i);
    if (twice.length > 0) return { ok: false, message: `Column(s) ${[...new Set(twice)].join(', ')} appear more than once.` };
    header.forEach((key, i) => (record[key] = rows[1]![i] ?? ''));
  }
  return fromRecord(record);
}

/** Reads a spec file by its extension (`json` or `csv`). */
export function parseSpecFile(body: string, extension: string): SpecFileParse {
  return extension === 'json' ? fromJson(body) : fromCsv(body);
}
