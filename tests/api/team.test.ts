import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
let admin: string;
let engineer: string;
beforeAll(async () => {
  server = await startServer();
  admin = await signIn(server.url, 'admin@resetwise.example');
  engineer = await signIn(server.url, 'engineer@resetwise.example');
});
afterAll(async () => {
  await server?.stop();
});

const call = (method: string, path: string, cookie?: string, body?: unknown) =>
  fetch(`${server.url}${path}`, {
    method,
    headers: { 'content-type': 'application/json', origin: server.url, ...(cookie ? { cookie } : {}) },
    ...(body !== undefined ? { body: JSON.stringify(body) } : {}),
  });

describe('team API', () => {
  it('401 without a session, 403 for a non-admin, 200 for an admin', async () => {
    expect((await call('GET', '/api/v1/users')).status).toBe(401);
    expect((await call('GET', '/api/v1/users', engineer)).status).toBe(403);
    const reply = await call('GET', '/api/v1/users', admin);
    expect(reply.status).toBe(200);
    const { users } = await reply.json();
    expect(users).toHaveLength(6);
    expect(JSON.stringify(users)).not.toMatch(/argon2|password/i);
  });

  it('a non-admin cannot create members even with a valid body (403 before 400)', async () => {
    expect((await call('POST', '/api/v1/users', engineer, { email: 'x@y.example', name: 'X', role: 'admin', password: 'long-enough-1' })).status).toBe(403);
    expect((await call('POST', '/api/v1/users', engineer, { nonsense: true })).status).toBe(403);
  });

  it('rejects bad members field by field and writes nothing', async () => {
    const reply = await call('POST', '/api/v1/users', admin, { email: 'nope', name: '', role: 'boss', password: 'short' });
    expect(reply.status).toBe(400);
    const { fields } = await reply.json();
    expect(Object.fromEntries(fields.map((f: { field: string; message: string }) => [f.field, f.message]))).toEqual({
      email: 'email must be an e-mail address such as name@example.com',
      name: 'name is required',
      role: 'role must be one of admin, architect, engineer, sales',
      password: 'password must have at least 10 characters',
    });
    const { users } = await (await call('GET', '/api/v1/users', admin)).json();
    expect(users).toHaveLength(6);
  });

  it('adds a member who can then sign in; a duplicate e-mail is 409', async () => {
    const reply = await call('POST', '/api/v1/users', admin, { email: 'Quinn@Halvard.example', name: 'Quinn Ashby', role: 'engineer', password: 'quinn-password-1' });
    expect(reply.status).toBe(201);
    const created = await reply.json();
    expect(created).toMatchObject({ email: 'quinn@halvard.example', name: 'Quinn Ashby', role: 'engineer', active: true });
    expect(typeof created.id).toBe('string');
    await signIn(server.url, 'quinn@halvard.example', 'quinn-password-1');
    const twin = await call('POST', '/api/v1/users', admin, { email: 'quinn@halvard.example', name: 'Twin', role: 'sales', password: 'another-password' });
    expect(twin.status).toBe(409);
  });

  it('changing a role takes effect on the next request; deactivation ends sessions at once', async () => {
    const { users } = await (await call('GET', '/api/v1/users', admin)).json();
    const sales = users.find((u: { email: string }) => u.email === 'sales@resetwise.example');
    const salesCookie = await signIn(server.url, 'sales@resetwise.example');
    const promoted = await call('PATCH', `/api/v1/users/${sales.id}`, admin, { role: 'architect' });
    expect((await promoted.json()).role).toBe('architect');
    expect((await (await call('GET', '/api/v1/auth/me', salesCookie)).json()).user.role).toBe('architect');

    const off = await call('PATCH', `/api/v1/users/${sales.id}`, admin, { active: false });
    expect(off.status).toBe(200);
    expect((await call('GET', '/api/v1/auth/me', salesCookie)).status).toBe(401);
    const again = await call('POST', '/api/v1/auth/sign-in', undefined, { email: 'sales@resetwise.example', password: 'resetwise-demo' });
    expect(again.status).toBe(401);
  });

  it('concurrent writes are neither lost nor corrupted (PGlite serialises them)', async () => {
    const emails = Array.from({ length: 12 }, (_, i) => `parallel${i}@halvard.example`);
    const replies = await Promise.all(
      emails.map((email, i) => call('POST', '/api/v1/users', admin, { email, name: `Parallel ${i}`, role: 'engineer', password: 'parallel-password' })),
    );
    expect(replies.map((r) => r.status)).toEqual(emails.map(() => 201));
    const { users } = await (await call('GET', '/api/v1/users', admin)).json();
    const listed = new Set(users.map((u: { email: string }) => u.email));
    for (const email of emails) expect(listed.has(email)).toBe(true);
  });

  it('PATCH validates and knows unknown members', async () => {
    expect((await call('PATCH', '/api/v1/users/demo-engineer', admin, {})).status).toBe(400);
    expect((await call('PATCH', '/api/v1/users/demo-engineer', admin, { active: 'yes' })).status).toBe(400);
    expect((await call('PATCH', '/api/v1/users/no-such-id', admin, { active: true })).status).toBe(404);
    const lastAdmin = await call('PATCH', '/api/v1/users/demo-admin', admin, { role: 'sales' });
    expect(lastAdmin.status).toBe(409);
  });

  it('pages: anonymous visitors are sent to sign-in; Team is for admins only', async () => {
    const anon = await fetch(`${server.url}/team`, { redirect: 'manual' });
    expect(anon.status).toBe(302);
    expect(anon.headers.get('location')).toBe('/sign-in?next=%2Fteam');
    expect((await fetch(`${server.url}/team`, { headers: { cookie: engineer } })).status).toBe(403);
    const page = await fetch(`${server.url}/team`, { headers: { cookie: admin } });
    expect(page.status).toBe(200);
    expect(await page.text()).toMatch(/Add a member/);
  });
});
