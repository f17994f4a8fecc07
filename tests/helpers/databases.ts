import { randomBytes } from 'node:crypto';
import { afterAll, beforeAll } from 'vitest';
import { seedDemo } from '../../src/db/seed';
import { openDatabase, type Database } from '../../src/db/client';

export interface Backend {
  name: 'pglite' | 'postgres';
  /** A new, empty, migrated database of this kind. */
  open(): Promise<Database>;
}

/**
 * The database kinds every database test runs on: in-memory PGlite always, and PostgreSQL
 * when TEST_DATABASE_URL names a server (npm test starts a throw-away one). In CI a missing
 * server is an error, not a skip.
 */
export function backends(): Backend[] {
  const list: Backend[] = [{ name: 'pglite', open: () => openDatabase({ dataDir: 'memory://' }) }];
  const url = process.env.TEST_DATABASE_URL;
  if (url) list.push({ name: 'postgres', open: () => openFreshPostgres(url) });
  else if (process.env.CI) throw new Error('TEST_DATABASE_URL must be set in CI (see .ci/run)');
  return list;
}

async function openFreshPostgres(serverUrl: string): Promise<Database> {
  const { default: pg } = await import('pg');
  const name = `rw_test_${randomBytes(6).toString('hex')}`;
  const admin = new pg.Client({ connectionString: serverUrl });
  await admin.connect();
  await admin.query(`create database ${name}`);
  await admin.end();
  const url = new URL(serverUrl);
  url.pathname = `/${name}`;
  const database = await openDatabase({ databaseUrl: url.toString() });
  return {
    ...database,
    async close() {
      await database.close();
      const cleanup = new pg.Client({ connectionString: serverUrl });
      await cleanup.connect();
      await cleanup.query(`drop database if exists ${name}`);
      await cleanup.end();
    },
  };
}

/**
 * A database of `backend` with the demo workspace seeded (passwords stored as `plain:…`), opened before the
 * tests of the enclosing describe block and closed after them. Call the returned function inside a test.
 */
export function seededDemoDatabase(backend: Backend): () => Database {
  let database: Database | undefined;
  beforeAll(async () => {
    database = await backend.open();
    await seedDemo(database.db, async (password) => `plain:${password}`);
  });
  afterAll(async () => {
    await database?.close();
  });
  return () => {
    if (!database) throw new Error('the seeded database is opened in beforeAll; use it inside a test');
    return database;
  };
}
