import type { Db } from '../../db/client';
import { writeLibraryVersion, type UploadRecord } from '../../db/queries/parts';
import type { PartCategory } from '../../engine/parts/types';
import type { FieldProblem } from '../../lib/server/http';
import { partSchemaOf } from '../../schemas/parts';
import { applyChanges, emptyCategoryProblems, fieldChanges, locatePart, summariseChanges, type PartChange } from './changes';
import { categoryInfo } from './categories';
import { currentLibrary, invalidateLibrary, toStoredLibrary } from './library.server';

export type EditOutcome =
  | { kind: 'written'; version: number; changes: PartChange[]; uploadId: string | null }
  | { kind: 'unchanged'; version: number }
  | { kind: 'invalid'; message: string; fields: FieldProblem[] }
  | { kind: 'missing' }
  | { kind: 'duplicate'; message: string }
  | { kind: 'stale'; currentVersion: number };

/**
 * Writes a set of changes as the next library version after checking the whole result (no
 * category left without a usable part). `baseVersion` defaults to the version read here.
 */
export async function commitChanges(
  db: Db, actorId: string, changes: PartChange[],
  options: { baseVersion?: number | undefined; summary?: string; upload?: UploadRecord } = {},
): Promise<EditOutcome> {
  const { library, version } = await currentLibrary(db);
  if (options.baseVersion !== undefined && options.baseVersion !== version) return { kind: 'stale', currentVersion: version };
  if (changes.length === 0) return { kind: 'unchanged', version };
  const next = applyChanges(library, changes);
  const problems = emptyCategoryProblems(next);
  if (problems.length > 0) return { kind: 'invalid', message: 'The library would be left without a part the engine may choose.', fields: problems.map((message) => ({ field: 'library', message })) };
  const outcome = await writeLibraryVersion(db, {
    library: toStoredLibrary(next),
    summary: options.summary ?? summariseChanges(changes),
    changes: changes.map(({ op, category, id, fields }) => ({ op, category, id, ...(fields ? { fields } : {}) })),
    actorId,
    baseVersion: version,
    ...(options.upload ? { upload: options.upload } : {}),
  });
  invalidateLibrary(db);
  if (outcome.kind === 'stale') return outcome;
  return { kind: 'written', version: outcome.version, changes, uploadId: outcome.uploadId };
}

function checkPart(category: PartCategory, raw: Record<string, unknown>): { ok: true; part: Record<string, unknown> } | { ok: false; fields: FieldProblem[] } {
  const parsed = partSchemaOf(category).safeParse(raw);
  if (parsed.success) return { ok: true, part: parsed.data };
  return { ok: false, fields: parsed.error.issues.map((i) => ({ field: ['part', ...i.path.map(String)].join('.'), message: i.message })) };
}

/** Adds one part; its id must be new across every category. */
export async function addPart(db: Db, actorId: string, category: PartCategory, raw: Record<string, unknown>, baseVersion?: number): Promise<EditOutcome> {
  const checked = checkPart(category, raw);
  if (!checked.ok) return { kind: 'invalid', message: 'Some fields are not valid.', fields: checked.fields };
  const { library } = await currentLibrary(db);
  const existing = locatePart(library, checked.part.id as string);
  if (existing) return { kind: 'duplicate', message: `A ${categoryInfo(existing.category)!.singular} with id ${existing.part.id} is already in the library; ids are unique.` };
  return commitChanges(db, actorId, [{ op: 'add', category, id: checked.part.id as string, part: checked.part }], { baseVersion });
}

/** Replaces one part's fields; the id and category stay as they are. */
export async function updatePart(db: Db, actorId: string, id: string, raw: Record<string, unknown>, baseVersion?: number): Promise<EditOutcome> {
  const { library } = await currentLibrary(db);
  const existing = locatePart(library, id);
  if (!existing) return { kind: 'missing' };
  if (raw.id !== undefined && raw.id !== id) return { kind: 'invalid', message: 'Some fields are not valid.', fields: [{ field: 'part.id', message: 'the id of a part cannot change; add a new part and retire this one instead' }] };
  const checked = checkPart(existing.category, { ...raw, id });
  if (!checked.ok) return { kind: 'invalid', message: 'Some fields are not valid.', fields: checked.fields };
  const fields = fieldChanges(existing.part, checked.part);
  const changes: PartChange[] = Object.keys(fields).length === 0 ? [] : [{ op: 'change', category: existing.category, id, fields, part: checked.part }];
  return commitChanges(db, actorId, changes, { baseVersion });
}

/** Removes one part from the library (earlier versions keep it). */
export async function retirePart(db: Db, actorId: string, id: string, baseVersion?: number): Promise<EditOutcome> {
  const { library } = await currentLibrary(db);
  const existing = locatePart(library, id);
  if (!existing) return { kind: 'missing' };
  return commitChanges(db, actorId, [{ op: 'retire', category: existing.category, id }], { baseVersion });
}
