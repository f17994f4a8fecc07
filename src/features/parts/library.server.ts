import type { Db } from '../../db/client';
import { currentLibraryVersion, getLibraryVersion, seedLibraryIfEmpty } from '../../db/queries/parts';
import type { PartsLibrary, StoredLibrary } from '../../engine/parts/types';
import { parseStoredLibrary } from '../../schemas/parts';
import { SEED_SUMMARY, seedLibraryJson } from './seed-library';

export interface CurrentLibrary {
  library: PartsLibrary;
  version: number;
}

/** Parsed latest version per database handle; replaced when a newer version appears. */
const cache = new WeakMap<Db, CurrentLibrary>();

/**
 * The library every server evaluation uses: the newest stored version. An empty table (a
 * production workspace on first use) is seeded with the built-in demo parts, because the engine
 * always needs a library. The parsed version is cached; on PostgreSQL one cheap max(version)
 * query per call keeps several server processes on one database in step (the embedded database
 * has one writer, so there the version is known without asking).
 */
export async function currentLibrary(db: Db): Promise<CurrentLibrary> {
  let latest = await currentLibraryVersion(db);
  if (latest === null) {
    await seedLibraryIfEmpty(db, seedLibraryJson(), SEED_SUMMARY);
    latest = (await currentLibraryVersion(db))!;
  }
  const hit = cache.get(db);
  if (hit && hit.version === latest) return hit;
  const loaded = await libraryAt(db, latest);
  if (!loaded) throw new Error(`parts library version ${latest} vanished while loading`);
  cache.set(db, loaded);
  return loaded;
}

/** Any stored version (for export and history); undefined when there is none. */
export async function libraryAt(db: Db, version: number): Promise<CurrentLibrary | undefined> {
  const hit = cache.get(db);
  if (hit && hit.version === version) return hit;
  const row = await getLibraryVersion(db, version);
  return row ? { library: parseStoredLibrary(row.library, row.version), version: row.version } : undefined;
}

/** Drops the cached library after a write (the next call loads the new version). */
export function invalidateLibrary(db: Db): void {
  cache.delete(db);
}

/** The stored JSON of a library (the version number lives in its own column). */
export function toStoredLibrary(library: PartsLibrary): StoredLibrary {
  const { version: _version, ...rest } = library;
  return rest;
}
