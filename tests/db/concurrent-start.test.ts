import { randomBytes } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { openDatabase } from '../../src/db/client';
import { seedDemo } from '../../src/db/seed';

/**
 * Issue 16: several processes opening one empty PostgreSQL database at the same moment. Each open migrates, and the
 * demo seed follows; without the advisory lock two migrating at once collided in PostgreSQL's catalogue
 * (duplicate key in pg_type) and one start failed. Eight opens at once here, as eight processes would.
 */
const serverUrl = process.env.TEST_DATABASE_URL;
if (!serverUrl && process.env.CI) throw new Error('TEST_DATABASE_URL must be set in CI (see .ci/run)');

describe.skipIf(!serverUrl)('opening one empty PostgreSQL database from many starts at once', () => {
  it('every open succeeds, the migrations run once and the demo is seeded once', async () => {
    const { default: pg } = await import('pg');
    const name = `rw_race_${randomBytes(6).toString('hex')}`;
    const admin = new pg.Client({ connectionString: serverUrl });
    await admin.connect();
    await admin.query(`create database ${name}`);
    const url = new URL(serverUrl!);
    url.pathname = `/${name}`;
    try {
      const seed = (db: Parameters<typeof seedDemo>[0]) => seedDemo(db, async (password) => `plain:${password}`);
      const opened = await Promise.allSettled(Array.from({ length: 8 }, () => openDatabase({ databaseUrl: url.toString(), prepare: seed })));
      const failures = opened.filter((o) => o.status === 'rejected').map((o) => String((o as PromiseRejectedResult).reason));
      for (const o of opened) if (o.status === 'fulfilled') await o.value.close();
      expect(failures).toEqual([]);
      const check = new pg.Client({ connectionString: url.toString() });
      await check.connect();
      const migrations = await check.query('select count(*)::int as n, count(distinct hash)::int as distinct_n from drizzle.__drizzle_migrations');
      const seeded = await check.query("select count(*)::int as n from audit_log where action = 'demo.seeded'");
      await check.end();
      expect(migrations.rows[0].n).toBe(migrations.rows[0].distinct_n);
      expect(seeded.rows[0].n).toBe(1);
    } finally {
      await admin.query(`drop database if exists ${name} with (force)`);
      await admin.end();
    }
  }, 120_000);
});
