import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import path from 'node:path';

export interface RunningServer {
  url: string;
  dataDir: string;
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
  // RESETWISE_DIST lets a developer test a build made with `astro build --outDir …`.
  const entry = path.resolve(process.env.RESETWISE_DIST ?? 'dist', 'server/entry.mjs');
  if (!existsSync(entry)) throw new Error(`${entry} is missing: run \`npm run build\` (npm test does it)`);
  const port = await freePort();
  const dataDir = env.DATA_DIR ?? mkdtempSync(path.join(tmpdir(), 'resetwise-test-'));
  let log = '';
  const child: ChildProcess = spawn(process.execPath, [entry], {
    env: { ...process.env, HOST: '127.0.0.1', PORT: String(port), RESETWISE_DEMO: '1', ...env, DATA_DIR: dataDir },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  child.stdout?.on('data', (chunk: Buffer) => (log += chunk.toString()));
  child.stderr?.on('data', (chunk: Buffer) => (log += chunk.toString()));
  const url = `http://127.0.0.1:${port}`;
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (child.exitCode !== null) throw new Error(`server exited early:\n${log}`);
    try {
      if ((await fetch(`${url}/api/v1/health`)).ok) break;
    } catch {
      // not listening yet
    }
    if (Date.now() > deadline) throw new Error(`server did not become ready:\n${log}`);
    await new Promise((r) => setTimeout(r, 100));
  }
  return {
    url,
    dataDir,
    output: () => log,
    async stop() {
      if (child.exitCode === null) {
        const exited = new Promise((r) => child.once('exit', r));
        child.kill('SIGTERM');
        await exited;
      }
      rmSync(dataDir, { recursive: true, force: true });
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
