import { partsOf, type AnyPart, type PartCategory, type PartsLibrary } from '../../engine/parts/types';
import { CATEGORIES, categoryInfo } from './categories';

/**
 * Per-part changes between two library versions, as stored in `parts_library_versions.changes`
 * and shown in the history and the import preview. Pure; safe on both sides.
 */

export type ChangeOp = 'add' | 'change' | 'retire';

export interface FieldChange {
  from: unknown;
  to: unknown;
}

export interface PartChange {
  op: ChangeOp;
  category: PartCategory;
  id: string;
  /** For `change`: each field that differs. */
  fields?: Record<string, FieldChange>;
  /** For `add` and `change`: the part as it reads afterwards. */
  part?: Record<string, unknown>;
}

export type PartRecord = Record<string, unknown> & { id: string; status: string };

const same = (a: unknown, b: unknown): boolean => JSON.stringify(a) === JSON.stringify(b);

/** The fields that differ between two versions of one part (tiers compared as a whole). */
export function fieldChanges(before: Record<string, unknown>, after: Record<string, unknown>): Record<string, FieldChange> {
  const out: Record<string, FieldChange> = {};
  for (const key of new Set([...Object.keys(before), ...Object.keys(after)])) {
    if (!same(before[key], after[key])) out[key] = { from: before[key] ?? null, to: after[key] ?? null };
  }
  return out;
}

/** Where a part id lives in a library, or undefined. Ids are unique across every category. */
export function locatePart(library: PartsLibrary, id: string): { category: PartCategory; index: number; part: PartRecord } | undefined {
  for (const { key } of CATEGORIES) {
    const list = partsOf(library, key);
    const index = list.findIndex((p) => p.id === id);
    if (index >= 0) return { category: key, index, part: list[index]! };
  }
  return undefined;
}

/** A new library with the changes applied (the input is not mutated). */
export function applyChanges(library: PartsLibrary, changes: readonly PartChange[]): PartsLibrary {
  const lists = new Map<PartCategory, AnyPart[]>(CATEGORIES.map(({ key }) => [key, [...partsOf(library, key)]]));
  for (const change of changes) {
    const list = lists.get(change.category)!;
    const index = list.findIndex((p) => p.id === change.id);
    // Parts in a change were checked against their category's schema (partSchemaOf) before they got here.
    if (change.op === 'add') list.push(change.part as AnyPart);
    else if (change.op === 'change' && index >= 0) list[index] = change.part as AnyPart;
    else if (change.op === 'retire' && index >= 0) list.splice(index, 1);
  }
  return { ...library, ...(Object.fromEntries(lists) as Pick<PartsLibrary, PartCategory>) };
}

/**
 * The engine picks only parts not marked "not for new designs"; a category left without one
 * would make every scheme fail for lack of a part, so such a change is refused.
 */
export function emptyCategoryProblems(library: PartsLibrary): string[] {
  const problems: string[] = [];
  for (const { key, label } of CATEGORIES) {
    const usable = partsOf(library, key).filter((p) => p.status !== 'nfnd');
    if (usable.length === 0) problems.push(`${label} would have no part left that the engine may choose (preferred or allowed); keep at least one`);
  }
  return problems;
}

/** One line for the history: "2 added, 1 changed, 1 retired (mosfets, cores)". */
export function summariseChanges(changes: readonly PartChange[]): string {
  const count = (op: ChangeOp): number => changes.filter((c) => c.op === op).length;
  const parts = [[count('add'), 'added'], [count('change'), 'changed'], [count('retire'), 'retired']]
    .filter(([n]) => (n as number) > 0)
    .map(([n, word]) => `${n} ${word}`);
  if (parts.length === 0) return 'no changes';
  const categories = [...new Set(changes.map((c) => categoryInfo(c.category)?.singular ?? c.category))];
  return `${parts.join(', ')} (${categories.join(', ')})`;
}
