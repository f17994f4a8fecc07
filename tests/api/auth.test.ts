import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, startServer, type RunningServer } from '../helpers/server';
import { demoAccounts } from '../../src/demo/accounts';

let server: RunningServer;
beforeAll(async () => {
  server = await startServer();
});
afterAll(async () => {
  await server?.stop();
});

const post = (path: string, body: unknown, headers: Record<string, string> = {}) =>
  fetch(`${server.url}${path}`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin: server.url, ...headers },
    body: typeof body === 'string' ? body : JSON.stringify(body),
  });
const me = (cookie: string) => fetch(`${server.url}/api/v1/auth/me`, { headers: { cookie } });

describe('sign-in API', () => {
  it.each(demoAccounts.map((a) => [a.email, a.role] as const))('%s signs in as %s', async (email, role) => {
    const cookie = await signIn(server.url, email);
    const reply = await me(cookie);
    expect(reply.status).toBe(200);
    expect((await reply.json()).user).toMatchObject({ email, role });
  });

  it('sets an httpOnly, SameSite=Lax, Secure (production build) cookie', async () => {
    const reply = await post('/api/v1/auth/sign-in', { email: 'sales@resetwise.example', password: 'resetwise-demo' });
    const cookie = reply.headers.getSetCookie().find((c) => c.startsWith('rw_session='))!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).toMatch(/Secure/i);
  });

  it('answers bad bodies with 400 and a plain reason per field', async () => {
    const reply = await post('/api/v1/auth/sign-in', { email: 'not-an-email', password: '', extra: 1 });
    expect(reply.status).toBe(400);
    const body = await reply.json();
    expect(body.error).toBe('Some fields are not valid.');
    const fields = body.fields.map((f: { field: string }) => f.field);
    expect(fields).toEqual(expect.arrayContaining(['email', 'password']));
    expect(JSON.stringify(body)).toMatch(/unknown field\(s\): extra/);
    expect((await post('/api/v1/auth/sign-in', '{nope')).status).toBe(400);
    const wrongType = await fetch(`${server.url}/api/v1/auth/sign-in`, { method: 'POST', body: 'email=a' });
    expect(wrongType.status).toBe(400);
    expect((await wrongType.json()).error).toMatch(/JSON/);
  });

  it('a wrong password is 401 with a message that does not say which part was wrong', async () => {
    const reply = await post('/api/v1/auth/sign-in', { email: 'architect@resetwise.example', password: 'wrong-password' });
    expect(reply.status).toBe(401);
    expect((await reply.json()).error).toBe('The e-mail or password is wrong, or the account is deactivated.');
    const unknown = await post('/api/v1/auth/sign-in', { email: 'nobody@resetwise.example', password: 'wrong-password' });
    expect(unknown.status).toBe(401);
  });

  it('throttles an account after 5 failures with 429, Retry-After and a clear message', async () => {
    const body = { email: 'engineer3@resetwise.example', password: 'wrong-password' };
    for (let i = 0; i < 5; i++) expect((await post('/api/v1/auth/sign-in', body)).status).toBe(401);
    const blocked = await post('/api/v1/auth/sign-in', { ...body, password: 'resetwise-demo' });
    expect(blocked.status).toBe(429);
    expect(Number(blocked.headers.get('retry-after'))).toBeGreaterThan(800);
    expect((await blocked.json()).error).toMatch(/Too many failed sign-ins\. Try again in 15 minutes\./);
  });

  it('a plain form post (before the page script loads) signs in and redirects to a local page only', async () => {
    const form = (fields: Record<string, string>) =>
      fetch(`${server.url}/api/v1/auth/sign-in`, {
        method: 'POST', redirect: 'manual',
        headers: { 'content-type': 'application/x-www-form-urlencoded', origin: server.url },
        body: new URLSearchParams(fields).toString(),
      });
    const ok = await form({ email: 'engineer2@resetwise.example', password: 'resetwise-demo', next: '/specs' });
    expect(ok.status).toBe(303);
    expect(ok.headers.get('location')).toBe('/specs');
    expect(ok.headers.getSetCookie().some((c) => c.startsWith('rw_session='))).toBe(true);
    const offsite = await form({ email: 'engineer2@resetwise.example', password: 'resetwise-demo', next: '//evil.example/x' });
    expect(offsite.headers.get('location')).toBe('/');
    const wrong = await form({ email: 'engineer2@resetwise.example', password: 'nope-nope-nope', next: '/specs' });
    expect(wrong.status).toBe(303);
    expect(wrong.headers.get('location')).toBe('/sign-in?error=credentials&next=%2Fspecs');
    expect(wrong.headers.getSetCookie()).toHaveLength(0);
  });

  it('sign-out ends the session on the server', async () => {
    const cookie = await signIn(server.url, 'engineer@resetwise.example');
    expect((await post('/api/v1/auth/sign-out', {}, { cookie })).status).toBe(200);
    expect((await me(cookie)).status).toBe(401);
  });

  it('signing in again issues a new session id and ends the one the browser brought (no fixation)', async () => {
    const first = await signIn(server.url, 'architect@resetwise.example');
    const reply = await post('/api/v1/auth/sign-in', { email: 'architect@resetwise.example', password: 'resetwise-demo' }, { cookie: first });
    const second = reply.headers.getSetCookie().find((c) => c.startsWith('rw_session='))!.split(';')[0]!;
    expect(second).not.toBe(first);
    expect((await me(first)).status).toBe(401);
    expect((await me(second)).status).toBe(200);
  });

  it('refuses writes from another origin, JSON included', async () => {
    const reply = await post('/api/v1/auth/sign-in', { email: 'admin@resetwise.example', password: 'resetwise-demo' }, { origin: 'http://evil.example' });
    expect(reply.status).toBe(403);
    expect(reply.headers.getSetCookie()).toHaveLength(0);
    const crossSite = await post('/api/v1/auth/sign-out', {}, { origin: '', 'sec-fetch-site': 'cross-site' });
    expect(crossSite.status).toBe(403);
  });

  it('unknown API routes answer JSON 404; pages answer a 404 page without internals', async () => {
    const api = await fetch(`${server.url}/api/v1/nothing-here`);
    expect(api.status).toBe(404);
    expect(await api.json()).toEqual({ error: 'No such API route.' });
    const page = await fetch(`${server.url}/no/such/page`);
    expect(page.status).toBe(404);
    const html = await page.text();
    expect(html).toMatch(/Nothing here/);
    expect(html).not.toMatch(/at .*\.(js|ts):\d+/);
  });
});
