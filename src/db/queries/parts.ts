import { desc, eq, max } from 'drizzle-orm';
import { hasSingleWriter, type Db } from '../client';
import { newId } from '../ids';
import { partsLibraryVersions, uploads, users, type PartsLibraryVersion } from '../schema';
import { recordAudit } from './audit';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
type Writer = Db | Tx;

/** Newest library version number, or null before the library is seeded. */
export async function latestLibraryVersion(db: Writer): Promise<number | null> {
  const rows = await db.select({ version: max(partsLibraryVersions.version) }).from(partsLibraryVersions);
  return rows[0]?.version ?? null;
}

/** Newest version seen per single-writer database (versions only ever grow). */
const knownLatest = new WeakMap<Db, number>();

function noteLatest(db: Db, version: number): void {
  if (version >= 1 && hasSingleWriter(db)) knownLatest.set(db, Math.max(knownLatest.get(db) ?? 0, version));
}

/**
 * The newest library version for reading (every evaluation asks). On the embedded database this
 * process is the only writer and `writeLibraryVersion` notes each new version, so after the first
 * read no query is needed; on PostgreSQL, which several processes may share, it always asks.
 * Inside a transaction use `latestLibraryVersion(tx)`.
 */
export async function currentLibraryVersion(db: Db): Promise<number | null> {
  const known = knownLatest.get(db);
  if (known !== undefined) return known;
  const version = await latestLibraryVersion(db);
  if (version !== null) noteLatest(db, version);
  return version;
}

export interface LibraryVersionRow {
  version: number;
  library: PartsLibraryVersion['library'];
  summary: string;
  createdAt: Date;
}

export async function getLibraryVersion(db: Db, version: number): Promise<LibraryVersionRow | undefined> {
  const rows = await db
    .select({ version: partsLibraryVersions.version, library: partsLibraryVersions.library, summary: partsLibraryVersions.summary, createdAt: partsLibraryVersions.createdAt })
    .from(partsLibraryVersions)
    .where(eq(partsLibraryVersions.version, version))
    .limit(1);
  return rows[0];
}

export interface HistoryEntry {
  version: number;
  summary: string;
  changes: Record<string, unknown>[];
  actorName: string | null;
  createdAt: Date;
  uploadId: string | null;
  uploadName: string | null;
}

/** Library versions, newest first, with who made each and the import file when there was one. */
export async function listLibraryHistory(db: Db, limit = 200): Promise<HistoryEntry[]> {
  const rows = await db
    .select({
      version: partsLibraryVersions.version,
      summary: partsLibraryVersions.summary,
      changes: partsLibraryVersions.changes,
      actorName: users.displayName,
      createdAt: partsLibraryVersions.createdAt,
    })
    .from(partsLibraryVersions)
    .leftJoin(users, eq(users.id, partsLibraryVersions.actorId))
    .orderBy(desc(partsLibraryVersions.version))
    .limit(limit);
  const files = await db
    .select({ id: uploads.id, filename: uploads.filename, relatedId: uploads.relatedId })
    .from(uploads)
    .where(eq(uploads.relatedType, 'parts-library'));
  const fileOf = new Map(files.map((f) => [f.relatedId, f]));
  return rows.map((r) => ({ ...r, uploadId: fileOf.get(String(r.version))?.id ?? null, uploadName: fileOf.get(String(r.version))?.filename ?? null }));
}

/** Seeds version 1 when the table is empty; a no-op (false) otherwise. */
export async function seedLibraryIfEmpty(db: Writer, library: PartsLibraryVersion['library'], summary: string): Promise<boolean> {
  const added = await db
    .insert(partsLibraryVersions)
    .values({ version: 1, library, summary, changes: [], actorId: null })
    .onConflictDoNothing()
    .returning({ version: partsLibraryVersions.version });
  return added.length > 0;
}

export interface UploadRecord {
  filename: string;
  sizeBytes: number;
  mimeType: string;
  sha256: string;
  storedName: string;
  /** The file's bytes, kept in the row. */
  content: Buffer;
}

export interface NewLibraryVersion {
  library: PartsLibraryVersion['library'];
  summary: string;
  changes: Record<string, unknown>[];
  actorId: string;
  /** The version the change was made against; a newer current version makes it stale. */
  baseVersion: number;
  /** The import file, recorded with the version in the same transaction. */
  upload?: UploadRecord;
}

export type LibraryWriteOutcome = { kind: 'written'; version: number; uploadId: string | null } | { kind: 'stale'; currentVersion: number };

/**
 * Writes the next library version, its audit entry and (for imports) the upload row in one
 * transaction. The primary key on `version` keeps two concurrent writers from both winning.
 */
export async function writeLibraryVersion(db: Db, input: NewLibraryVersion): Promise<LibraryWriteOutcome> {
  const outcome = await db.transaction(async (tx): Promise<LibraryWriteOutcome> => {
    const current = (await latestLibraryVersion(tx)) ?? 0;
    if (current !== input.baseVersion) return { kind: 'stale', currentVersion: current };
    const version = current + 1;
    await tx.insert(partsLibraryVersions).values({ version, library: input.library, summary: input.summary, changes: input.changes, actorId: input.actorId });
    let uploadId: string | null = null;
    if (input.upload) {
      uploadId = newId();
      await tx.insert(uploads).values({ id: uploadId, ...input.upload, uploaderId: input.actorId, relatedType: 'parts-library', relatedId: String(version) });
    }
    await recordAudit(tx, {
      actorId: input.actorId, action: 'parts.version', entityType: 'parts-library', entityId: String(version),
      details: { summary: input.summary, changes: input.changes.length, ...(uploadId ? { uploadId } : {}) },
    });
    return { kind: 'written', version, uploadId };
  });
  // Noted after the commit, so a reader never sees a version that could still roll back.
  noteLatest(db, outcome.kind === 'written' ? outcome.version : outcome.currentVersion);
  return outcome;
}
