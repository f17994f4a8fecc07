#!/usr/bin/env node
// `npm test`: type checks, a production build, then every vitest suite (unit, API against the
// built server, browser). Database tests run on PGlite and on PostgreSQL: TEST_DATABASE_URL
// names a server to use; without it a throw-away cluster is started here (scripts/pg-cluster.sh).
// The API suite then runs a second time with the server on PostgreSQL (DATABASE_URL).
import { spawnSync } from 'node:child_process';
import { chmodSync, mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
process.chdir(root);
const env = { ...process.env, ASTRO_TELEMETRY_DISABLED: '1' };

function run(label, command, args, extraEnv = {}) {
  console.log(`\n▶ ${label}`);
  const result = spawnSync(command, args, { stdio: 'inherit', env: { ...env, ...extraEnv } });
  if (result.status !== 0) {
    console.error(`✗ ${label} failed`);
    return false;
  }
  return true;
}

if (!run('Type check (astro check)', 'npx', ['astro', 'check'])) process.exit(1);
if (!run('Build', 'npx', ['astro', 'build'])) process.exit(1);
writeFileSync(path.join(root, 'dist', '.built-at'), new Date().toISOString());

let cluster;
if (!env.TEST_DATABASE_URL) {
  const dir = mkdtempSync(path.join(tmpdir(), 'resetwise-pg-'));
  chmodSync(dir, 0o755);
  const port = String(20000 + Math.floor(Math.random() * 20000));
  const started = spawnSync('bash', ['scripts/pg-cluster.sh', 'start', path.join(dir, 'pg'), port], { encoding: 'utf8' });
  if (started.status === 0) {
    cluster = path.join(dir, 'pg');
    env.TEST_DATABASE_URL = started.stdout.trim();
    console.log(`\n▶ Throw-away PostgreSQL for the database tests: ${env.TEST_DATABASE_URL}`);
  } else if (env.CI) {
    console.error(`✗ Could not start PostgreSQL for the tests:\n${started.stderr}`);
    process.exit(1);
  } else {
    console.warn('! No PostgreSQL server binaries; PostgreSQL variants of the database tests are skipped.');
  }
}

let ok = run('Tests (vitest)', 'npx', ['vitest', 'run', ...process.argv.slice(2)]);
// The API suite again, with the server on a real PostgreSQL database (DATABASE_URL mode).
if (ok && env.TEST_DATABASE_URL && process.argv.length <= 2) {
  ok = run('API tests on PostgreSQL', 'npx', ['vitest', 'run', 'tests/api'], { RESETWISE_TEST_DB: 'postgres' });
}
if (cluster) spawnSync('bash', ['scripts/pg-cluster.sh', 'stop', cluster], { stdio: 'inherit' });
process.exit(ok ? 0 : 1);
