import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { PGlite } from '@electric-sql/pglite';
import { sql } from 'drizzle-orm';
import { openDatabase, type Db } from '../../src/db/client';
import { makeDatabaseTemplate } from '../../scripts/db-template.mjs';

const dir = mkdtempSync(path.join(tmpdir(), 'resetwise-template-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));
/** Rows of a raw query (the driver's result shape differs by database, the rows do not). */
const rows = async (db: Db, query: ReturnType<typeof sql>): Promise<unknown[]> => ((await db.execute(query)) as unknown as { rows: unknown[] }).rows;
const migrations = (JSON.parse(readFileSync('drizzle/meta/_journal.json', 'utf8')) as { entries: unknown[] }).entries.length;

describe('a new embedded database from the build template (scripts/db-template.mjs)', () => {
  it('the template holds every migration', async () => {
    const bytes = await makeDatabaseTemplate('drizzle');
    const client = await PGlite.create({ loadDataDir: new Blob([bytes]) });
    try {
      const { rows } = await client.query<{ n: number }>('select count(*)::int as n from drizzle.__drizzle_migrations');
      expect(rows[0]!.n).toBe(migrations);
    } finally {
      await client.close();
    }
  }, 60_000);

  it('an empty folder starts from the template, keeps its writes, and a restart opens it as it is', async () => {
    // A template with a marker table: seeing the marker proves the folder came from the template, not initdb.
    const source = await PGlite.create();
    await source.exec('create table template_marker (id int primary key); insert into template_marker values (7);');
    const templatePath = path.join(dir, 'template.tar.gz');
    writeFileSync(templatePath, Buffer.from(await (await source.dumpDataDir('gzip')).arrayBuffer()));
    await source.close();

    const dataDir = path.join(dir, 'data');
    const first = await openDatabase({ dataDir, templatePath });
    expect(existsSync(path.join(dataDir, 'pg', 'PG_VERSION'))).toBe(true);
    expect(await rows(first.db, sql`select id from template_marker`)).toEqual([{ id: 7 }]);
    // The migrations ran on top of it (the marker template had none).
    expect(await rows(first.db, sql`select count(*)::int as n from drizzle.__drizzle_migrations`)).toEqual([{ n: migrations }]);
    await first.db.execute(sql`insert into template_marker values (8)`);
    await first.close();

    // A restart never loads the template over an existing database, even when the file is still there.
    const again = await openDatabase({ dataDir, templatePath });
    expect(await rows(again.db, sql`select id from template_marker order by id`)).toEqual([{ id: 7 }, { id: 8 }]);
    await again.close();
  }, 60_000);
});
