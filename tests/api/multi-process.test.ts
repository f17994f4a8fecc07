import { createHash, randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { freshPostgresDatabase, signIn, startServer, type RunningServer } from '../helpers/server';

/**
 * Issue 16: how a team outgrows one machine — two built server processes on one PostgreSQL database, started at
 * the same moment on an empty database. Before, one of them answered its first request with a 500 (both ran the
 * migrations: duplicate key in pg_type) and the sign-in throttle counted per process.
 *
 * Runs once, in the first pass of `npm test` (the second pass puts every API test on PostgreSQL anyway), against
 * the throw-away cluster named by TEST_DATABASE_URL.
 */
const serverUrl = process.env.TEST_DATABASE_URL;
if (!serverUrl && process.env.CI) throw new Error('TEST_DATABASE_URL must be set in CI (see .ci/run)');
const run = serverUrl && process.env.RESETWISE_TEST_DB !== 'postgres' ? describe : describe.skip;

const VOTERS = 500;

run('two server processes on one PostgreSQL database', () => {
  let database: Awaited<ReturnType<typeof freshPostgresDatabase>>;
  let a: RunningServer;
  let b: RunningServer;
  let pg: import('pg').Client;

  beforeAll(async () => {
    database = await freshPostgresDatabase();
    // Both at the same moment, on a database with no tables yet.
    [a, b] = await Promise.all([startServer({ DATABASE_URL: database.url }), startServer({ DATABASE_URL: database.url })]);
    const { default: pgModule } = await import('pg');
    pg = new pgModule.Client({ connectionString: database.url });
    await pg.connect();
  }, 120_000);
  afterAll(async () => {
    await pg?.end();
    await Promise.all([a?.stop(), b?.stop()]);
    await database?.drop();
  });

  it('both answer their first request without a 5xx, and the demo is seeded once', async () => {
    expect(a.readyStatuses.every((s) => s < 500), `A: ${a.readyStatuses.join(' ')}\n${a.output()}`).toBe(true);
    expect(b.readyStatuses.every((s) => s < 500), `B: ${b.readyStatuses.join(' ')}\n${b.output()}`).toBe(true);
    const seeded = await pg.query("select count(*)::int as n from audit_log where action = 'demo.seeded'");
    expect(seeded.rows[0].n).toBe(1);
    const migrations = await pg.query('select count(*)::int as n, count(distinct hash)::int as distinct_n from drizzle.__drizzle_migrations');
    expect(migrations.rows[0].n).toBe(migrations.rows[0].distinct_n);
  });

  it('the sign-in throttle counts the failures of both processes together', async () => {
    const attempt = (server: RunningServer, password: string) =>
      fetch(`${server.url}/api/v1/auth/sign-in`, {
        method: 'POST', headers: { 'content-type': 'application/json', origin: server.url },
        body: JSON.stringify({ email: 'engineer3@resetwise.example', password }),
      });
    for (const server of [a, b, a, b, a]) expect((await attempt(server, 'wrong-password')).status).toBe(401);
    expect((await attempt(b, 'resetwise-demo')).status).toBe(429);
    expect((await attempt(a, 'resetwise-demo')).status).toBe(429);
  });

  it(`${VOTERS} voters split across both processes: an exact tally and no double vote`, async () => {
    // The voters and their sessions go straight into the database: signing 500 people in would time argon2, not ballots.
    const { rows: [demo] } = await pg.query("select password_hash from users where id = 'demo-engineer'");
    const run = randomBytes(4).toString('hex');
    const cookies: string[] = [];
    const ids: string[] = [];
    for (let i = 0; i < VOTERS; i += 100) {
      const batch = Array.from({ length: Math.min(100, VOTERS - i) }, (_, j) => i + j);
      const users = batch.map((n) => [`voter-${run}-${n}`, `voter${n}-${run}@load.example`, `Voter ${n}`]);
      await pg.query(
        `insert into users (id, email, display_name, role, password_hash) select id, email, name, 'engineer', $1 from unnest($2::text[], $3::text[], $4::text[]) as t(id, email, name)`,
        [demo.password_hash, users.map((u) => u[0]), users.map((u) => u[1]), users.map((u) => u[2])],
      );
      const tokens = batch.map(() => randomBytes(20).toString('base64url'));
      await pg.query(
        `insert into sessions (id, user_id, expires_at) select id, user_id, now() + interval '12 hours' from unnest($1::text[], $2::text[]) as t(id, user_id)`,
        [tokens.map((t) => createHash('sha256').update(t).digest('hex')), users.map((u) => u[0])],
      );
      ids.push(...users.map((u) => u[0]!));
      cookies.push(...tokens.map((t) => `rw_session=${t}`));
    }
    const architect = await signIn(a.url, 'architect@resetwise.example');
    const post = async (server: RunningServer, path: string, body: unknown, cookie = architect) => {
      const reply = await fetch(`${server.url}/api/v1${path}`, { method: 'POST', headers: { 'content-type': 'application/json', origin: server.url, cookie }, body: JSON.stringify(body) });
      expect(reply.status, `${path}: ${await reply.clone().text()}`).toBeLessThan(300);
      return reply.json();
    };
    const shortlist = await post(a, '/shortlists', { specId: 'demo-spec-1', title: `Two processes ${run}` });
    const candidates: string[] = [];
    for (const scheme of ['two-switch', 'active-clamp', 'rcd-clamp']) candidates.push((await post(b, `/shortlists/${shortlist.id}/candidates`, { scheme })).id);
    await post(a, `/shortlists/${shortlist.id}/open`, { deadline: new Date(Date.now() + 2 * 86_400_000).toISOString(), voterIds: ids });

    // Every voter at once, alternating processes; every fifth voter sends two ballots at once, one to each process.
    const cast = (server: RunningServer, cookie: string, i: number) =>
      fetch(`${server.url}/api/v1/shortlists/${shortlist.id}/ballot`, {
        method: 'PUT', headers: { 'content-type': 'application/json', origin: server.url, cookie },
        body: JSON.stringify({ ranking: [...candidates.slice(i % 3), ...candidates.slice(0, i % 3)], concerns: [], comment: '' }),
      }).then((r) => r.status);
    const statuses = await Promise.all(cookies.flatMap((cookie, i) => (i % 5 === 0 ? [cast(a, cookie, i), cast(b, cookie, i)] : [cast(i % 2 === 0 ? a : b, cookie, i)])));
    expect(statuses.filter((s) => s >= 300), `refused or failed: ${[...new Set(statuses)].join(', ')}`).toEqual([]);

    await post(b, `/shortlists/${shortlist.id}/close`, {});
    const stored = await pg.query('select count(*)::int as n, count(distinct voter_id)::int as voters from ballots where shortlist_id = $1', [shortlist.id]);
    expect(stored.rows[0]).toEqual({ n: VOTERS, voters: VOTERS });
    for (const server of [a, b]) {
      const view = await (await fetch(`${server.url}/api/v1/shortlists/${shortlist.id}`, { headers: { cookie: architect } })).json();
      expect(view.tally.ballots).toBe(VOTERS);
      expect(view.tally.candidates.reduce((sum: number, c: { borda: number }) => sum + c.borda, 0)).toBe(VOTERS * 3);
    }
  }, 180_000);

  it('SIGTERM to one process in the middle of a write storm: it exits 0 and loses no acknowledged write', async () => {
    const architect = await signIn(a.url, 'architect@resetwise.example');
    const acknowledged: string[] = [];
    const failed: string[] = [];
    let stopping: Promise<number | null> | undefined;
    const write = async (n: number): Promise<void> => {
      try {
        const reply = await fetch(`${a.url}/api/v1/shortlists`, {
          method: 'POST', headers: { 'content-type': 'application/json', origin: a.url, cookie: architect },
          body: JSON.stringify({ specId: 'demo-spec-2', title: `Storm ${n}` }),
        });
        if (reply.status === 201) acknowledged.push((await reply.json()).id);
        else failed.push(String(reply.status));
      } catch (error) {
        failed.push((error as Error).message);
      }
      if (acknowledged.length === 40 && !stopping) stopping = a.kill('SIGTERM');
    };
    // 20 writers, one write after another each, until the process is gone.
    await Promise.all(Array.from({ length: 20 }, async (_, w) => {
      for (let n = w; n < 4000 && !(stopping && failed.length > 40); n += 20) await write(n);
    }));
    const code = await stopping;
    expect(code, a.output()).toBe(0);
    expect(acknowledged.length).toBeGreaterThanOrEqual(40);
    const { rows } = await pg.query('select id from shortlists where id = any($1::text[])', [acknowledged]);
    expect(rows.length, `acknowledged ${acknowledged.length}, stored ${rows.length}`).toBe(acknowledged.length);
    // The other process is untouched and sees every one of them.
    const listed = await (await fetch(`${b.url}/api/v1/shortlists?specId=demo-spec-2`, { headers: { cookie: await signIn(b.url, 'architect@resetwise.example') } })).json();
    const seen = new Set(listed.shortlists.map((s: { id: string }) => s.id));
    expect(acknowledged.filter((id) => !seen.has(id))).toEqual([]);
    console.log(`SIGTERM in a write storm: ${acknowledged.length} writes acknowledged, all stored; ${failed.length} refused or cut off after the signal (${[...new Set(failed)].slice(0, 4).join('; ')})`);
  }, 120_000);
});
