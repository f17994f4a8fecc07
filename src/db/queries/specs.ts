import { and, desc, eq, isNull, sql } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { Db } from '../client';
import { newId } from '../ids';
import { specs, users, type Spec } from '../schema';
import { recordAudit } from './audit';

export interface SpecSummary {
  id: string;
  name: string;
  customer: string;
  ownerId: string;
  ownerName: string;
  requirements: Spec['requirements'];
  version: number;
  engineVersion: string | null;
  archivedAt: Date | null;
  createdAt: Date;
  updatedAt: Date;
  updatedByName: string | null;
}

export interface SpecDetail extends SpecSummary {
  comparison: Spec['comparison'];
  evaluatedAt: Date | null;
}

const editor = alias(users, 'editor');
const summaryColumns = {
  id: specs.id,
  name: specs.name,
  customer: specs.customer,
  ownerId: specs.ownerId,
  ownerName: users.displayName,
  requirements: specs.requirements,
  version: specs.version,
  engineVersion: specs.engineVersion,
  archivedAt: specs.archivedAt,
  createdAt: specs.createdAt,
  updatedAt: specs.updatedAt,
  updatedByName: editor.displayName,
};

/** Requirement sets, most recently updated first, with owner and last editor names. */
export async function listSpecSummaries(db: Db, options: { includeArchived?: boolean; limit?: number } = {}): Promise<SpecSummary[]> {
  return db
    .select(summaryColumns)
    .from(specs)
    .innerJoin(users, eq(users.id, specs.ownerId))
    .leftJoin(editor, eq(editor.id, specs.updatedById))
    .where(options.includeArchived ? undefined : isNull(specs.archivedAt))
    .orderBy(desc(specs.updatedAt))
    .limit(options.limit ?? 500);
}

export async function getSpec(db: Db, id: string): Promise<SpecDetail | undefined> {
  const rows = await db
    .select({ ...summaryColumns, comparison: specs.comparison, evaluatedAt: specs.evaluatedAt })
    .from(specs)
    .innerJoin(users, eq(users.id, specs.ownerId))
    .leftJoin(editor, eq(editor.id, specs.updatedById))
    .where(eq(specs.id, id))
    .limit(1);
  return rows[0];
}

export interface SpecWrite {
  name: string;
  customer: string;
  requirements: Spec['requirements'];
  comparison: NonNullable<Spec['comparison']>;
  engineVersion: string;
}

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

/** Creates a set; `alongside` writes related rows (e.g. the imported file) in the same transaction. */
export async function createSpec(db: Db, input: SpecWrite, actorId: string, alongside?: (tx: Tx, specId: string) => Promise<void>): Promise<string> {
  const id = newId();
  const now = new Date();
  await db.transaction(async (tx) => {
    await tx.insert(specs).values({ id, ...input, ownerId: actorId, updatedById: actorId, evaluatedAt: now, createdAt: now, updatedAt: now });
    await recordAudit(tx, { actorId, action: 'spec.created', entityType: 'spec', entityId: id, details: { name: input.name } });
    if (alongside) await alongside(tx, id);
  });
  return id;
}

export type UpdateOutcome =
  | { kind: 'updated'; version: number }
  | { kind: 'stale'; currentVersion: number; updatedAt: Date; updatedByName: string | null }
  | { kind: 'missing' };

/**
 * Saves a new version only if the caller edited the current one (optimistic locking): the
 * UPDATE matches on the version, so two concurrent saves cannot both win.
 */
export async function updateSpec(db: Db, id: string, expectedVersion: number, input: SpecWrite, actorId: string): Promise<UpdateOutcome> {
  const outcome = await db.transaction(async (tx): Promise<UpdateOutcome> => {
    const now = new Date();
    const updated = await tx
      .update(specs)
      .set({ ...input, version: sql`${specs.version} + 1`, updatedById: actorId, evaluatedAt: now, updatedAt: now })
      .where(and(eq(specs.id, id), eq(specs.version, expectedVersion), isNull(specs.archivedAt)))
      .returning({ version: specs.version });
    if (updated[0]) {
      await recordAudit(tx, { actorId, action: 'spec.updated', entityType: 'spec', entityId: id, details: { version: updated[0].version } });
      return { kind: 'updated', version: updated[0].version };
    }
    return { kind: 'missing' };
  });
  if (outcome.kind !== 'missing') return outcome;
  const current = await getSpec(db, id);
  if (!current || current.archivedAt) return { kind: 'missing' };
  return { kind: 'stale', currentVersion: current.version, updatedAt: current.updatedAt, updatedByName: current.updatedByName };
}

/** Archives (soft-deletes) a set; false when there is no such active set. */
export async function archiveSpec(db: Db, id: string, actorId: string): Promise<boolean> {
  return db.transaction(async (tx) => {
    const rows = await tx
      .update(specs)
      .set({ archivedAt: new Date(), updatedById: actorId })
      .where(and(eq(specs.id, id), isNull(specs.archivedAt)))
      .returning({ id: specs.id });
    if (rows.length === 0) return false;
    await recordAudit(tx, { actorId, action: 'spec.archived', entityType: 'spec', entityId: id });
    return true;
  });
}
