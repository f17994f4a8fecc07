import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
const cookies: Record<string, string> = {};
beforeAll(async () => {
  server = await startServer();
  for (const role of ['architect', 'engineer', 'sales']) cookies[role] = await signIn(server.url, `${role}@resetwise.example`);
});
afterAll(async () => {
  await server?.stop();
});

const get = (path: string, role?: string): Promise<Response> =>
  fetch(`${server.url}/api/v1${path}`, { headers: role ? { cookie: cookies[role]! } : {} });
const post = async (path: string, role: string, body: unknown): Promise<{ status: number; body: { id: string } }> => {
  const r = await fetch(`${server.url}/api/v1${path}`, { method: 'POST', headers: { 'content-type': 'application/json', origin: server.url, cookie: cookies[role]! }, body: JSON.stringify(body) });
  return { status: r.status, body: await r.json() };
};

describe('GET /api/v1/specs/{id}/netlist', () => {
  it('serves a plain netlist download to every role, at the asked input voltage', async () => {
    for (const role of ['engineer', 'sales']) {
      const r = await get('/specs/demo-spec-1/netlist?scheme=active-clamp&vin=max', role);
      expect(r.status).toBe(200);
      expect(r.headers.get('content-type')).toContain('text/plain');
      expect(r.headers.get('content-disposition')).toMatch(/^attachment; filename="[a-z0-9-]+-active-clamp-vin-max\.cir"$/);
      const text = await r.text();
      expect(text).toMatch(/^\* Resetwise SPICE netlist - Active clamp forward converter/);
      expect(text).toMatch(/^VIN in 0 DC 7\.5e\+1$/m); // the brick's 75 V maximum
      expect(text).toContain('.meas tran vsw_pk MAX v(d)');
    }
    const nominal = await (await get('/specs/demo-spec-1/netlist?scheme=two-switch', 'engineer')).text();
    expect(nominal).toMatch(/^VIN in 0 DC 4\.8e\+1$/m); // vin defaults to nom (48 V)
  });

  it('401 signed out, 400 with named fields, 404 unknown set', async () => {
    expect((await get('/specs/demo-spec-1/netlist?scheme=two-switch')).status).toBe(401);
    const bad = await get('/specs/demo-spec-1/netlist?scheme=flyback&vin=peak', 'engineer');
    expect(bad.status).toBe(400);
    const body = await bad.json() as { fields: { field: string; message: string }[] };
    expect(body.fields.map((f) => f.field).sort()).toEqual(['scheme', 'vin']);
    expect(body.fields.find((f) => f.field === 'vin')!.message).toBe('vin must be min, nom or max');
    const extra = await get('/specs/demo-spec-1/netlist?scheme=two-switch&step=1n', 'engineer');
    expect(extra.status).toBe(400);
    expect((await get('/specs/no-such-spec/netlist?scheme=two-switch', 'engineer')).status).toBe(404);
  });
});

describe('GET /api/v1/shortlists/{id}/candidates/{candidateId}/netlist', () => {
  it('draws the candidate from its frozen snapshot; sales only once decided; 404 for unknown ids', async () => {
    const created = await post('/shortlists', 'architect', { specId: 'demo-spec-1', title: `Netlist check ${Math.random().toString(36).slice(2, 7)}` });
    expect(created.status).toBe(201);
    const added = await post(`/shortlists/${created.body.id}/candidates`, 'architect', { scheme: 'rcd-clamp', note: 'netlist' });
    expect(added.status).toBe(201);
    const path = `/shortlists/${created.body.id}/candidates/${added.body.id}/netlist?vin=min`;
    const r = await get(path, 'engineer');
    expect(r.status).toBe(200);
    const text = await r.text();
    expect(text).toMatch(/^\* Resetwise SPICE netlist - RCD clamp/);
    expect(text).toMatch(/^VIN in 0 DC 3\.6e\+1$/m);
    expect(text).toMatch(/^DCL d cl DIDEAL$/m);
    expect((await get(path, 'sales')).status).toBe(403); // a draft is not decided
    expect((await get(`/shortlists/${created.body.id}/candidates/nope/netlist`, 'engineer')).status).toBe(404);
    expect((await get(`/shortlists/${created.body.id}/candidates/${added.body.id}/netlist?vin=high`, 'engineer')).status).toBe(400);
  });
});
