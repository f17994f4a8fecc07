import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { signIn, startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
const cookies: Record<string, string> = {};
beforeAll(async () => {
  server = await startServer();
  for (const role of ['admin', 'architect', 'engineer', 'sales']) cookies[role] = await signIn(server.url, `${role}@resetwise.example`);
});
afterAll(async () => {
  await server?.stop();
});

const call = (method: string, path: string, role?: string, body?: unknown) =>
  fetch(`${server.url}${path}`, {
    method,
    headers: { 'content-type': 'application/json', origin: server.url, ...(role ? { cookie: cookies[role]! } : {}) },
    ...(body !== undefined ? { body: JSON.stringify(body) } : {}),
  });

const telecom = JSON.parse(readFileSync('examples/telecom-brick-36-75v-12v.json', 'utf8'));

describe('POST /api/v1/evaluate', () => {
  it('401 without a session', async () => {
    expect((await call('POST', '/api/v1/evaluate', undefined, telecom)).status).toBe(401);
  });

  it.each(['admin', 'architect', 'engineer', 'sales'])('%s gets the comparison with every scheme', async (role) => {
    const reply = await call('POST', '/api/v1/evaluate', role, telecom);
    expect(reply.status).toBe(200);
    const body = await reply.json();
    expect(body.results.map((r: { scheme: string }) => r.scheme)).toEqual(['tertiary-winding', 'rcd-clamp', 'active-clamp', 'two-switch', 'resonant-reset']);
    expect(body.ranking).toHaveLength(5);
    expect(typeof body.engineVersion).toBe('string');
  });

  it('400 names each bad field in plain words', async () => {
    const reply = await call('POST', '/api/v1/evaluate', 'engineer', { ...telecom, vinMinV: 400, vinMaxV: 300, fswHz: 'fast' });
    expect(reply.status).toBe(400);
    const { fields } = await reply.json();
    const messages = fields.map((f: { message: string }) => f.message).join('\n');
    expect(messages).toMatch(/fswHz/);
    const crossField = await call('POST', '/api/v1/evaluate', 'engineer', { ...telecom, vinMinV: 400, vinMaxV: 300, vinNomV: 350 });
    expect((await crossField.json()).fields[0].message).toBe('vinMinV (400) must not exceed vinMaxV (300)');
  });
});

describe('specs API', () => {
  it('lists the demo sets for every role; 401 without a session; 400 on a bad query', async () => {
    expect((await call('GET', '/api/v1/specs')).status).toBe(401);
    for (const role of ['admin', 'architect', 'engineer', 'sales']) {
      const reply = await call('GET', '/api/v1/specs', role);
      expect(reply.status).toBe(200);
      expect((await reply.json()).specs.length).toBeGreaterThanOrEqual(3);
    }
    expect((await call('GET', '/api/v1/specs?archived=maybe', 'sales')).status).toBe(400);
  });

  it('engineers and sales may not create (403); architects create with a server evaluation (201)', async () => {
    const body = { name: 'Rack 48 V to 5 V', customer: 'Fjord Robotics (fictional)', requirements: telecom };
    expect((await call('POST', '/api/v1/specs', 'engineer', body)).status).toBe(403);
    expect((await call('POST', '/api/v1/specs', 'sales', body)).status).toBe(403);
    const reply = await call('POST', '/api/v1/specs', 'architect', body);
    expect(reply.status).toBe(201);
    const created = await reply.json();
    expect(created).toMatchObject({ name: 'Rack 48 V to 5 V', version: 1, archived: false, owner: { name: 'Mateo Ruiz' } });
    expect(created.requirements.vinMinV).toBe(36);
    expect(created.requirements.rippleRatio).toBe(0.3); // defaults are filled when stored
    const comparison = await (await call('GET', `/api/v1/specs/${created.id}/comparison`, 'sales')).json();
    expect(comparison.reevaluated).toBe(false);
    expect(comparison.comparison.results).toHaveLength(5);
  });

  it('400 for bad bodies, naming requirement fields by path; nothing is written', async () => {
    const before = (await (await call('GET', '/api/v1/specs', 'architect')).json()).specs.length;
    const reply = await call('POST', '/api/v1/specs', 'architect', { name: '', requirements: { ...telecom, voutV: -5 }, colour: 'red' });
    expect(reply.status).toBe(400);
    expect(JSON.stringify(await reply.json())).toMatch(/unknown field\(s\): colour/);
    const second = await call('POST', '/api/v1/specs', 'architect', { name: 'x', requirements: { ...telecom, voutV: -5 } });
    const { fields } = await second.json();
    expect(fields[0].field).toBe('requirements.voutV');
    expect(fields[0].message).toMatch(/voutV \(-5\) must be at least/);
    const after = (await (await call('GET', '/api/v1/specs', 'architect')).json()).specs.length;
    expect(after).toBe(before);
  });

  it('PUT saves a new version; a stale version is 409 with who saved; 404 for unknown ids', async () => {
    const created = await (await call('POST', '/api/v1/specs', 'architect', { name: 'Versioned', requirements: telecom })).json();
    const v2 = await call('PUT', `/api/v1/specs/${created.id}`, 'admin', { version: 1, name: 'Versioned', customer: '', requirements: { ...telecom, vinMaxV: 80 } });
    expect(v2.status).toBe(200);
    expect(await v2.json()).toMatchObject({ version: 2, updatedBy: 'Ingrid Falk' });
    const stale = await call('PUT', `/api/v1/specs/${created.id}`, 'architect', { version: 1, name: 'Versioned', customer: '', requirements: telecom });
    expect(stale.status).toBe(409);
    const conflict = await stale.json();
    expect(conflict.currentVersion).toBe(2);
    expect(conflict.error).toMatch(/Ingrid Falk saved version 2/);
    const overwrite = await call('PUT', `/api/v1/specs/${created.id}`, 'architect', { version: 2, name: 'Versioned', customer: '', requirements: telecom });
    expect((await overwrite.json()).version).toBe(3);
    expect((await call('PUT', '/api/v1/specs/nope', 'architect', { version: 1, name: 'x', customer: '', requirements: telecom })).status).toBe(404);
    expect((await call('PUT', `/api/v1/specs/${created.id}`, 'engineer', { version: 3, name: 'x', customer: '', requirements: telecom })).status).toBe(403);
    expect((await call('PUT', `/api/v1/specs/${created.id}`, 'architect', { name: 'x', customer: '', requirements: telecom })).status).toBe(400);
  });

  it('GET one, 404 for unknown; DELETE archives (architect/admin only) and hides it from the list', async () => {
    const created = await (await call('POST', '/api/v1/specs', 'architect', { name: 'To archive', requirements: telecom })).json();
    expect((await call('GET', `/api/v1/specs/${created.id}`, 'sales')).status).toBe(200);
    expect((await call('GET', '/api/v1/specs/does-not-exist', 'sales')).status).toBe(404);
    expect((await call('GET', '/api/v1/specs/does-not-exist/comparison', 'sales')).status).toBe(404);
    expect((await call('DELETE', `/api/v1/specs/${created.id}`, 'engineer')).status).toBe(403);
    expect((await call('DELETE', `/api/v1/specs/${created.id}`)).status).toBe(401);
    expect((await call('DELETE', `/api/v1/specs/${created.id}`, 'architect')).status).toBe(200);
    expect((await call('DELETE', `/api/v1/specs/${created.id}`, 'architect')).status).toBe(404);
    const listed = (await (await call('GET', '/api/v1/specs', 'architect')).json()).specs.map((s: { id: string }) => s.id);
    expect(listed).not.toContain(created.id);
    const all = (await (await call('GET', '/api/v1/specs?archived=1', 'architect')).json()).specs.map((s: { id: string }) => s.id);
    expect(all).toContain(created.id);
    const archived = await call('PUT', `/api/v1/specs/${created.id}`, 'architect', { version: 1, name: 'x', customer: '', requirements: telecom });
    expect(archived.status).toBe(404);
  });

  it('seeded demo sets are evaluated on request under the current engine', async () => {
    const reply = await call('GET', '/api/v1/specs/demo-spec-2/comparison', 'engineer');
    expect(reply.status).toBe(200);
    const body = await reply.json();
    expect(body.reevaluated).toBe(true);
    const twoSwitch = body.comparison.results.find((r: { scheme: string }) => r.scheme === 'two-switch');
    expect(twoSwitch.switchPeakV).toBeCloseTo(410, 6); // two-switch: each switch sees Vin,max (Hart §7.5 [from memory])
  });
});

describe('GET /api/v1/openapi.json', () => {
  it('is an OpenAPI 3.1 document covering every /api/v1 route, generated from the zod schemas', async () => {
    const reply = await fetch(`${server.url}/api/v1/openapi.json`);
    expect(reply.status).toBe(200);
    const doc = await reply.json();
    expect(doc.openapi).toBe('3.1.0');
    expect(Object.keys(doc.paths)).toEqual(
      expect.arrayContaining(['/auth/sign-in', '/auth/sign-out', '/users', '/users/{id}', '/evaluate', '/specs', '/specs/{id}', '/specs/{id}/comparison']),
    );
    const requirements = doc.paths['/specs'].post.requestBody.content['application/json'].schema.properties.requirements;
    expect(requirements.required).toEqual(expect.arrayContaining(['vinMinV', 'vinNomV', 'vinMaxV', 'voutV', 'ioutA', 'fswHz']));
    expect(doc.paths['/specs/{id}'].put.responses['409']).toBeDefined();
  });
});
