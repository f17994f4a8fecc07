import { spawn, type ChildProcess } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';

export interface RunningServer {
  url: string;
  port: number;
  dataDir: string;
  /** The server's process id (for its memory, or a signal). */
  pid: number;
  /** Every status /api/v1/health answered while the server was starting (connection refusals not counted). */
  readyStatuses: number[];
  /** Sends `signal` and resolves with the exit code once the process has ended. */
  kill(signal: NodeJS.Signals): Promise<number | null>;
  output(): string;
  stop(): Promise<void>;
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const probe = createServer();
    probe.once('error', reject);
    probe.listen(0, '127.0.0.1', () => {
      const address = probe.address();
      const port = typeof address === 'object' && address ? address.port : 0;
      probe.close(() => resolve(port));
    });
  });
}

/**
 * Starts the built server (dist/, or RESETWISE_DIST) on a free loopback port with a temporary data folder and
 * waits until it answers /api/v1/health. `npm test` builds first.
 */
export async function startServer(env: Record<string, string> = {}): Promise<RunningServer> {
  // RESETWISE_DIST lets a developer test a build made with `astro build --outDir …` (scripts/serve.mjs reads it).
  const built = path.resolve(process.env.RESETWISE_DIST ?? 'dist', 'server/entry.mjs');
  if (!existsSync(built)) throw new Error(`${built} is missing: run \`npm run build\` (npm test does it)`);
  const entry = path.resolve('scripts/serve.mjs');
  const port = await freePort();
  const dataDir = env.DATA_DIR ?? mkdtempSync(path.join(tmpdir(), 'resetwise-test-'));
  // RESETWISE_TEST_DB=postgres: the server gets a fresh database on the TEST_DATABASE_URL server.
  const postgres = process.env.RESETWISE_TEST_DB === 'postgres' && !env.DATA_DIR ? await freshPostgresDatabase() : undefined;
  if (postgres) env = { DATABASE_URL: postgres.url, ...env };
  let log = '';
  const child: ChildProcess = spawn(process.execPath, [entry], {
    env: { ...process.env, HOST: '127.0.0.1', PORT: String(port), RESETWISE_DEMO: '1', ...env, DATA_DIR: dataDir },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout?.on('data', (chunk: Buffer) => (log += chunk.toString()));
  child.stderr?.on('data', (chunk: Buffer) => (log += chunk.toString()));
  const url = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 60_000;
  const readyStatuses: number[] = [];
  const exited = new Promise<number | null>((resolve) => child.once('exit', (code) => resolve(code)));
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server exited early:\n${log}`);
    try {
      const health = await fetch(`${url}/api/v1/health`);
      readyStatuses.push(health.status);
      if (health.ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`server did not become ready:\n${log}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  return {
    url,
    port,
    dataDir,
    pid: child.pid!,
    readyStatuses,
    output: () => log,
    async kill(signal) {
      if (child.exitCode === null) child.kill(signal);
      return exited;
    },
    async stop() {
      if (child.exitCode === null) {
        const exited = new Promise((r) => child.once('exit', r));
        child.kill('SIGTERM');
        await exited;
      }
      rmSync(dataDir, { recursive: true, force: true });
      await postgres?.drop();
    },
  };
}

export async function freshPostgresDatabase(): Promise<{ url: string; drop(): Promise<void> }> {
  const serverUrl = process.env.TEST_DATABASE_URL;
  if (!serverUrl) throw new Error('RESETWISE_TEST_DB=postgres needs TEST_DATABASE_URL');
  const { default: pg } = await import('pg');
  const name = `rw_api_${randomBytes(6).toString('hex')}`;
  const admin = new pg.Client({ connectionString: serverUrl });
  await admin.connect();
  await admin.query(`create database ${name}`);
  await admin.end();
  const url = new URL(serverUrl);
  url.pathname = `/${name}`;
  return {
    url: url.toString(),
    async drop() {
      const client = new pg.Client({ connectionString: serverUrl });
      await client.connect();
      await client.query(`drop database if exists ${name} with (force)`);
      await client.end();
    },
  };
}

/** Signs in through the API and returns the Cookie header value for later requests. */
export async function signIn(url: string, email: string, password = 'resetwise-demo'): Promise<string> {
  const response = await fetch(`${url}/api/v1/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: url },
    body: JSON.stringify({ email, password }),
  });
  if (!response.ok) throw new Error(`sign-in as ${email} failed: ${response.status} ${await response.text()}`);
  return cookieFrom(response);
}

export function cookieFrom(response: Response): string {
  const setCookie = response.headers.getSetCookie().find((c) => c.startsWith('rw_session='));
  if (!setCookie) throw new Error('no session cookie in the reply');
  return setCookie.split(';')[0]!;
}
