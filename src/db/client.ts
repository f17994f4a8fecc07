import path from 'node:path';
import { existsSync, mkdirSync, readFileSync } from 'node:fs';
import { gunzipSync } from 'node:zlib';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import * as schema from './schema';

export type Schema = typeof schema;
/** The one database type the app uses, whichever driver is underneath. */
export type Db = PgDatabase<PgQueryResultHKT, Schema>;

export interface DatabaseOptions {
  /** postgres:// URL of a PostgreSQL server; when set, PGlite is not used. */
  databaseUrl?: string | undefined;
  /** Folder for the embedded PGlite database; `memory://` for a throw-away one. */
  dataDir?: string | undefined;
  /** Folder with the drizzle-kit migrations (default `./drizzle` under the working directory). */
  migrationsDir?: string | undefined;
  /**
   * A new embedded database starts from this gzipped data folder (default `./dist/db-template.tar.gz`, written by
   * the build; scripts/db-template.mjs) when the file exists, instead of running PostgreSQL's initdb.
   */
  templatePath?: string | undefined;
  /**
   * Work that must follow the migrations exactly once however many processes start together (the demo seed).
   * On PostgreSQL it runs with the migrations under one advisory lock.
   */
  prepare?: ((db: Db) => Promise<unknown>) | undefined;
}

/**
 * The advisory lock key every Resetwise process takes to migrate and prepare a PostgreSQL database: the second
 * of two processes started together waits, then finds nothing left to do (two migrating at once collided on
 * PostgreSQL's catalogue: duplicate key in pg_type).
 */
export const MIGRATION_LOCK_KEY = 7_305_114_226_101;

export interface Database {
  db: Db;
  kind: 'pglite' | 'postgres';
  close(): Promise<void>;
}

/** PGlite's smallest accepted initial WebAssembly memory (2048 pages of 64 KiB). */
const PGLITE_INITIAL_MEMORY_BYTES = 128 * 1024 * 1024;
/** PostgreSQL's buffer cache inside PGlite (its default is 128 MB). */
const PGLITE_SHARED_BUFFERS = '32MB';

/** Handles whose only writer is this process (an embedded PGlite folder is opened by one process). */
const singleWriter = new WeakSet<object>();

/**
 * True for a database only this process writes (PGlite): what it wrote last is what is stored,
 * so a value it remembers after its own writes cannot be stale. False for a PostgreSQL server,
 * which other processes may share.
 */
export function hasSingleWriter(db: Db): boolean {
  return singleWriter.has(db);
}

const defaultMigrationsDir = (): string => path.resolve(process.cwd(), 'drizzle');
const defaultTemplatePath = (): string => path.resolve(process.cwd(), 'dist', 'db-template.tar.gz');

/**
 * Opens the database and applies every pending migration (then `prepare`) before returning.
 * PGlite serialises queries and transactions on its single connection itself, so one
 * instance per process is safe for concurrent requests; never open a second one on the
 * same folder from another process.
 */
export async function openDatabase(options: DatabaseOptions): Promise<Database> {
  const migrationsFolder = options.migrationsDir ?? defaultMigrationsDir();
  if (options.databaseUrl) {
    const { default: pg } = await import('pg');
    const { drizzle } = await import('drizzle-orm/node-postgres');
    const { migrate } = await import('drizzle-orm/node-postgres/migrator');
    const pool = new pg.Pool({ connectionString: options.databaseUrl, max: 10 });
    const client = await pool.connect();
    try {
      await client.query('select pg_advisory_lock($1)', [MIGRATION_LOCK_KEY]);
      const locked = drizzle(client, { schema });
      await migrate(locked, { migrationsFolder });
      await options.prepare?.(locked as unknown as Db);
    } finally {
      await client.query('select pg_advisory_unlock($1)', [MIGRATION_LOCK_KEY]).catch(() => undefined);
      client.release();
    }
    const db = drizzle(pool, { schema });
    return { db: db as unknown as Db, kind: 'postgres', close: () => pool.end() };
  }
  const { PGlite } = await import('@electric-sql/pglite');
  const { drizzle } = await import('drizzle-orm/pglite');
  const { migrate } = await import('drizzle-orm/pglite/migrator');
  const dataDir = options.dataDir ?? './data';
  let client: InstanceType<typeof PGlite>;
  // PGlite's default WebAssembly heap keeps ~700 MiB resident; starting at its 128 MiB minimum
  // (the heap still grows on demand) keeps the server near 300 MiB at rest. PostgreSQL's default
  // 128 MB of shared buffers then grows that heap to ~200 MiB at once; 32 MB holds a workspace's
  // hot pages (the rest are read through the operating system's file cache) and keeps it at
  // 128 MiB: a bare restart measured 298 → 193 MiB resident.
  const pgliteOptions = {
    initialMemory: PGLITE_INITIAL_MEMORY_BYTES,
    startParams: [...PGlite.defaultStartParams, '-c', `shared_buffers=${PGLITE_SHARED_BUFFERS}`],
  };
  if (dataDir.startsWith('memory://')) {
    client = await PGlite.create(pgliteOptions);
  } else {
    const dir = path.resolve(dataDir, 'pg');
    mkdirSync(dir, { recursive: true });
    // A new folder starts from the build's template (initdb and migrations done), and PGlite's heap does not
    // grow through initdb (scripts/db-template.mjs). Node's zlib unpacks it: PGlite given the gzipped file took
    // 0.8–1.2 s to load it, given the plain tar 0.5 s (+ 0.1 s here).
    const template = options.templatePath ?? defaultTemplatePath();
    const fresh = !existsSync(path.join(dir, 'PG_VERSION')) && existsSync(template);
    const loadDataDir = fresh ? new Blob([gunzipSync(readFileSync(template))], { type: 'application/x-tar' }) : undefined;
    client = await PGlite.create(dir, loadDataDir ? { ...pgliteOptions, loadDataDir } : pgliteOptions);
  }
  const db = drizzle(client, { schema });
  await migrate(db, { migrationsFolder });
  singleWriter.add(db);
  await options.prepare?.(db as unknown as Db);
  return { db: db as unknown as Db, kind: 'pglite', close: () => client.close() };
}
