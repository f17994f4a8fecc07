import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { listRoutes } from '../helpers/routes';
import { signIn, startServer, type RunningServer } from '../helpers/server';

/**
 * Every page and endpoint under src/pages, for every role, against one table. A route that is
 * not in the table fails the test, so a new route cannot ship without its access rule.
 * Writes send a body no schema accepts ({"__probe": true}) or name an id that does not exist,
 * so an allowed role gets 400/404 and nothing is changed; a refused role gets 401/403 first.
 */
type Who = 'anon' | 'sales' | 'engineer' | 'architect' | 'admin';
type Row = [anon: number, sales: number, engineer: number, architect: number, admin: number];
interface Probe {
  /** Path with the fixture's ids in place of [params] (and a query where one is required). */
  path: (ids: Fixture) => string;
  expect: Row;
  body?: 'probe' | 'none';
}
interface Fixture { shortlist: string; candidate: string; brief: string; upload: string }

const PROBE = { __probe: true };
const ALL = (status: number): Row => [401, status, status, status, status];
const PAGE = (status: number): Row => [302, status, status, status, status];

const TABLE: Record<string, Probe> = {
  // Pages: anonymous visitors are sent to sign-in (302); a role without the screen gets 403.
  'GET /': { path: () => '/', expect: [302, 302, 302, 302, 302] },
  'GET /403': { path: () => '/403', expect: [403, 403, 403, 403, 403] },
  'GET /404': { path: () => '/404', expect: [404, 404, 404, 404, 404] },
  'GET /500': { path: () => '/500', expect: [500, 500, 500, 500, 500] },
  'GET /sign-in': { path: () => '/sign-in', expect: [200, 302, 302, 302, 302] },
  'GET /specs': { path: () => '/specs', expect: PAGE(200) },
  'GET /specs/import': { path: () => '/specs/import', expect: [302, 200, 403, 200, 200] },
  // Sales try values in Compare (scratch or a saved set) but never save or sweep (issue 16).
  'GET /compare': { path: () => '/compare', expect: PAGE(200) },
  'GET /compare/[id]': { path: () => '/compare/demo-spec-1', expect: PAGE(200) },
  'GET /shortlists': { path: () => '/shortlists', expect: PAGE(200) },
  'GET /shortlists/[id]': { path: (f) => `/shortlists/${f.shortlist}`, expect: [302, 403, 200, 200, 200] },
  'GET /briefs': { path: () => '/briefs', expect: PAGE(200) },
  'GET /briefs/[id]': { path: (f) => `/briefs/${f.brief}`, expect: PAGE(200) },
  'GET /share/[token]': { path: () => '/share/not-a-real-token-0123456789abcdef', expect: [404, 404, 404, 404, 404] },
  'GET /parts': { path: () => '/parts', expect: PAGE(200) },
  'GET /parts/history': { path: () => '/parts/history', expect: PAGE(200) },
  // Sweep is engineering work: sales never sweep (issue 16).
  'GET /sweep': { path: () => '/sweep', expect: [302, 403, 200, 200, 200] },
  'GET /sweep/[id]': { path: () => '/sweep/demo-spec-1', expect: [302, 403, 200, 200, 200] },
  'GET /team': { path: () => '/team', expect: [302, 403, 403, 403, 200] },
  'GET /outbox': { path: () => '/outbox', expect: [302, 403, 403, 403, 200] },

  // Auth and service endpoints.
  'GET /api/v1/health': { path: () => '/api/v1/health', expect: [200, 200, 200, 200, 200] },
  'GET /api/v1/openapi.json': { path: () => '/api/v1/openapi.json', expect: [200, 200, 200, 200, 200] },
  'GET /api/v1/auth/me': { path: () => '/api/v1/auth/me', expect: ALL(200) },
  'POST /api/v1/auth/sign-in': { path: () => '/api/v1/auth/sign-in', body: 'probe', expect: [400, 400, 400, 400, 400] },
  'POST /api/v1/auth/sign-out': { path: () => '/api/v1/auth/sign-out', expect: [200, 200, 200, 200, 200] },
  'GET /api/v1/users': { path: () => '/api/v1/users', expect: [401, 403, 403, 403, 200] },
  'POST /api/v1/users': { path: () => '/api/v1/users', body: 'probe', expect: [401, 403, 403, 403, 400] },
  'PATCH /api/v1/users/[id]': { path: () => '/api/v1/users/demo-engineer3', body: 'probe', expect: [401, 403, 403, 403, 400] },
  'GET /api/v1/outbox': { path: () => '/api/v1/outbox', expect: [401, 403, 403, 403, 200] },

  // Requirement sets and comparisons: all read and try values (sales included); architects and admins write.
  'POST /api/v1/evaluate': { path: () => '/api/v1/evaluate', body: 'probe', expect: ALL(400) },
  'GET /api/v1/specs': { path: () => '/api/v1/specs', expect: ALL(200) },
  'POST /api/v1/specs': { path: () => '/api/v1/specs', body: 'probe', expect: [401, 403, 403, 400, 400] },
  'GET /api/v1/specs/[id]': { path: () => '/api/v1/specs/demo-spec-1', expect: ALL(200) },
  'PUT /api/v1/specs/[id]': { path: () => '/api/v1/specs/demo-spec-1', body: 'probe', expect: [401, 403, 403, 400, 400] },
  'DELETE /api/v1/specs/[id]': { path: () => '/api/v1/specs/no-such-spec', expect: [401, 403, 403, 404, 404] },
  'GET /api/v1/specs/[id]/comparison': { path: () => '/api/v1/specs/demo-spec-1/comparison', expect: ALL(200) },
  // Customer spec import: admins, architects and sales (a JSON body is not the multipart upload it wants).
  'POST /api/v1/specs/import': { path: () => '/api/v1/specs/import', body: 'probe', expect: [401, 400, 403, 400, 400] },
  'GET /api/v1/specs/[id]/netlist': { path: () => '/api/v1/specs/demo-spec-1/netlist?scheme=two-switch&vin=max', expect: ALL(200) },
  'GET /api/v1/uploads/[id]': { path: (f) => `/api/v1/uploads/${f.upload}`, expect: ALL(200) },

  // Shortlists: sales read decided ones only; engineers, architects, admins vote and propose; owners run them.
  'GET /api/v1/shortlists': { path: () => '/api/v1/shortlists', expect: ALL(200) },
  'POST /api/v1/shortlists': { path: () => '/api/v1/shortlists', body: 'probe', expect: [401, 403, 403, 400, 400] },
  'GET /api/v1/shortlists/[id]': { path: (f) => `/api/v1/shortlists/${f.shortlist}`, expect: [401, 403, 200, 200, 200] },
  'POST /api/v1/shortlists/[id]/candidates': { path: (f) => `/api/v1/shortlists/${f.shortlist}/candidates`, body: 'probe', expect: [401, 403, 400, 400, 400] },
  'DELETE /api/v1/shortlists/[id]/candidates/[candidateId]': { path: (f) => `/api/v1/shortlists/${f.shortlist}/candidates/no-such-candidate`, expect: [401, 403, 403, 404, 404] },
  'POST /api/v1/shortlists/[id]/candidates/[candidateId]/reevaluate': { path: (f) => `/api/v1/shortlists/${f.shortlist}/candidates/${f.candidate}/reevaluate`, body: 'probe', expect: [401, 403, 403, 400, 400] },
  'POST /api/v1/shortlists/[id]/open': { path: (f) => `/api/v1/shortlists/${f.shortlist}/open`, body: 'probe', expect: [401, 403, 403, 400, 400] },
  'PUT /api/v1/shortlists/[id]/ballot': { path: (f) => `/api/v1/shortlists/${f.shortlist}/ballot`, body: 'probe', expect: [401, 403, 400, 400, 400] },
  'POST /api/v1/shortlists/[id]/close': { path: (f) => `/api/v1/shortlists/${f.shortlist}/close`, body: 'probe', expect: [401, 403, 403, 400, 400] },
  'POST /api/v1/shortlists/[id]/decision': { path: (f) => `/api/v1/shortlists/${f.shortlist}/decision`, body: 'probe', expect: [401, 403, 403, 400, 400] },
  // A draft candidate's netlist: sales see decided shortlists only.
  'GET /api/v1/shortlists/[id]/candidates/[candidateId]/netlist': { path: (f) => `/api/v1/shortlists/${f.shortlist}/candidates/${f.candidate}/netlist?vin=nom`, expect: [401, 403, 200, 200, 200] },
  'POST /api/v1/shortlists/[id]/withdraw': { path: (f) => `/api/v1/shortlists/${f.shortlist}/withdraw`, body: 'probe', expect: [401, 403, 403, 400, 400] },

  // Parts library: everyone reads; admins edit.
  'GET /api/v1/parts': { path: () => '/api/v1/parts', expect: ALL(200) },
  'POST /api/v1/parts': { path: () => '/api/v1/parts', body: 'probe', expect: [401, 403, 403, 403, 400] },
  'PUT /api/v1/parts/[id]': { path: () => '/api/v1/parts/demo-sr-30v-a', body: 'probe', expect: [401, 403, 403, 403, 400] },
  'DELETE /api/v1/parts/[id]': { path: () => '/api/v1/parts/no-such-part', expect: [401, 403, 403, 403, 404] },
  'POST /api/v1/parts/import': { path: () => '/api/v1/parts/import', body: 'probe', expect: [401, 403, 403, 403, 400] },
  'GET /api/v1/parts/export.csv': { path: () => '/api/v1/parts/export.csv', expect: ALL(200) },
  'GET /api/v1/parts/history': { path: () => '/api/v1/parts/history', expect: ALL(200) },

  // Briefs: everyone reads; sales, architects and admins write and send.
  'GET /api/v1/briefs': { path: () => '/api/v1/briefs?specId=demo-spec-1', expect: ALL(200) },
  'POST /api/v1/briefs': { path: () => '/api/v1/briefs', body: 'probe', expect: [401, 400, 403, 400, 400] },
  'GET /api/v1/briefs/[id]': { path: (f) => `/api/v1/briefs/${f.brief}`, expect: ALL(200) },
  'PUT /api/v1/briefs/[id]': { path: (f) => `/api/v1/briefs/${f.brief}`, body: 'probe', expect: [401, 400, 403, 400, 400] },
  'POST /api/v1/briefs/[id]/send': { path: (f) => `/api/v1/briefs/${f.brief}/send`, body: 'probe', expect: [401, 400, 403, 400, 400] },
  'POST /api/v1/briefs/[id]/share': { path: (f) => `/api/v1/briefs/${f.brief}/share`, body: 'probe', expect: [401, 400, 403, 400, 400] },
  'DELETE /api/v1/briefs/[id]/share': { path: () => '/api/v1/briefs/no-such-brief/share', expect: [401, 404, 403, 404, 404] },
};

const WHO: Who[] = ['anon', 'sales', 'engineer', 'architect', 'admin'];
let server: RunningServer;
const cookies: Partial<Record<Who, string>> = {};
let fixture: Fixture;

beforeAll(async () => {
  server = await startServer();
  for (const who of WHO.slice(1)) cookies[who] = await signIn(server.url, `${who}@resetwise.example`);
  const post = async (path: string, who: Who, body: unknown, init: RequestInit = {}) => {
    const r = await fetch(`${server.url}${path}`, { method: 'POST', headers: { 'content-type': 'application/json', origin: server.url, cookie: cookies[who]! }, body: JSON.stringify(body), ...init });
    expect(r.status, `${path}: ${await r.clone().text()}`).toBeLessThan(300);
    return r.json();
  };
  const shortlist = await post('/api/v1/shortlists', 'architect', { specId: 'demo-spec-1', title: 'Access matrix' });
  const candidate = await post(`/api/v1/shortlists/${shortlist.id}/candidates`, 'architect', { scheme: 'two-switch' });
  const brief = await post('/api/v1/briefs', 'sales', { specId: 'demo-spec-1' });
  const form = new FormData();
  form.append('file', new Blob([JSON.stringify({ vinMinV: '36 V', vinNomV: '48 V', vinMaxV: '75 V', voutV: '12 V', ioutA: '5 A', fswHz: '200 kHz' })], { type: 'application/json' }), 'customer-spec.json');
  form.append('name', 'Matrix import');
  const imported = await fetch(`${server.url}/api/v1/specs/import`, { method: 'POST', headers: { origin: server.url, cookie: cookies.sales! }, body: form });
  expect(imported.status, await imported.clone().text()).toBe(201);
  fixture = { shortlist: shortlist.id, candidate: candidate.id, brief: brief.id, upload: (await imported.json()).upload.id };
});
afterAll(async () => {
  await server?.stop();
});

describe('route × role access matrix', () => {
  it('every route under src/pages has a row in the table (and no row is stale)', () => {
    const keys = listRoutes().map((r) => r.key);
    expect(keys.filter((k) => !(k in TABLE)), 'routes missing from the access table').toEqual([]);
    expect(Object.keys(TABLE).filter((k) => !keys.includes(k)), 'table rows without a route').toEqual([]);
  });

  it.each(listRoutes().map((r) => [r.key, r] as const))('%s', async (key, route) => {
    const probe = TABLE[key];
    if (!probe) return; // reported by the test above
    const actual: Record<string, number> = {};
    for (const [i, who] of WHO.entries()) {
      // Sign-out ends a session: use a fresh one so the other rows keep theirs.
      const cookie = who === 'anon' ? undefined : key === 'POST /api/v1/auth/sign-out' ? await signIn(server.url, `${who}@resetwise.example`) : cookies[who];
      const response = await fetch(`${server.url}${probe.path(fixture)}`, {
        method: route.method,
        redirect: 'manual',
        headers: { origin: server.url, ...(cookie ? { cookie } : {}), ...(probe.body === 'probe' ? { 'content-type': 'application/json' } : {}) },
        ...(probe.body === 'probe' ? { body: JSON.stringify(PROBE) } : {}),
      });
      actual[who] = response.status;
      if (response.status >= 400 && route.pattern.startsWith('/api/')) {
        const body = await response.json();
        expect(typeof body.error, `${key} as ${who}: JSON error message`).toBe('string');
      }
      void i;
    }
    expect(actual).toEqual(Object.fromEntries(WHO.map((who, i) => [who, probe.expect[i]])));
  });
});
