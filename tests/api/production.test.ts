import { spawnSync } from 'node:child_process';
import { mkdtempSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { signIn, startServer, type RunningServer } from '../helpers/server';

let server: RunningServer | undefined;
afterAll(async () => {
  await server?.stop();
});

describe('a production workspace (RESETWISE_DEMO=0)', () => {
  it('starts empty, takes its first admin from create-admin, and lists no demo accounts', async () => {
    const dataDir = mkdtempSync(path.join(tmpdir(), 'resetwise-prod-'));
    const env = { ...process.env, DATA_DIR: dataDir };
    const created = spawnSync('npx', ['tsx', 'scripts/create-admin.ts', '--email', 'Lead@Example.com', '--name', 'Lab Lead'], {
      input: 'a-long-admin-password\n', env, encoding: 'utf8',
    });
    expect(created.stderr).toBe('');
    expect(created.status).toBe(0);
    expect(created.stdout).toMatch(/Admin lead@example\.com created/);

    const short = spawnSync('npx', ['tsx', 'scripts/create-admin.ts', '--email', 'x@example.com', '--name', 'X'], { input: 'short\n', env, encoding: 'utf8' });
    expect(short.status).toBe(2);
    expect(short.stderr).toMatch(/password must have at least 10 characters/);

    server = await startServer({ RESETWISE_DEMO: '0', DATA_DIR: dataDir });
    const signInPage = await (await fetch(`${server.url}/sign-in`)).text();
    expect(signInPage).not.toMatch(/resetwise-demo|Demo accounts|fictional/);
    await expect(signIn(server.url, 'admin@resetwise.example')).rejects.toThrow(/401/);
    const cookie = await signIn(server.url, 'lead@example.com', 'a-long-admin-password');
    const overview = await (await fetch(`${server.url}/`, { headers: { cookie } })).text();
    expect(overview).toMatch(/No requirement sets yet/);
  });
});
