import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { signIn, startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
const cookies: Record<string, string> = {};
const ROLES = ['admin', 'architect', 'engineer', 'engineer2', 'engineer3', 'sales'];
beforeAll(async () => {
  server = await startServer();
  for (const role of ROLES) cookies[role] = await signIn(server.url, `${role}@resetwise.example`);
});
afterAll(async () => {
  await server?.stop();
});

const call = async (method: string, path: string, role?: string, body?: unknown) => {
  const response = await fetch(`${server.url}/api/v1${path}`, {
    method,
    headers: { 'content-type': 'application/json', origin: server.url, ...(role ? { cookie: cookies[role]! } : {}) },
    ...(body !== undefined ? { body: JSON.stringify(body) } : {}),
  });
  const text = await response.text();
  return { status: response.status, body: text ? JSON.parse(text) : null };
};
const inTwoDays = () => new Date(Date.now() + 2 * 86_400_000).toISOString();

/** A draft shortlist on the telecom demo spec with the given schemes. */
async function draftWith(schemes: string[]): Promise<{ id: string; candidates: string[] }> {
  const created = await call('POST', '/shortlists', 'architect', { specId: 'demo-spec-1', title: `Brick reset ${Math.random().toString(36).slice(2, 7)}` });
  expect(created.status).toBe(201);
  const candidates: string[] = [];
  for (const scheme of schemes) {
    const added = await call('POST', `/shortlists/${created.body.id}/candidates`, 'architect', { scheme, note: `${scheme} for the brick` });
    expect(added.status).toBe(201);
    candidates.push(added.body.id);
  }
  return { id: created.body.id, candidates };
}

describe('shortlist workflow and roles', () => {
  it('creates (architect), 401 anonymous, 403 engineer and sales, 400 bad body, 404 unknown spec', async () => {
    expect((await call('POST', '/shortlists', undefined, { specId: 'demo-spec-1', title: 'x' })).status).toBe(401);
    expect((await call('POST', '/shortlists', 'engineer', { specId: 'demo-spec-1', title: 'x' })).status).toBe(403);
    expect((await call('POST', '/shortlists', 'sales', { specId: 'demo-spec-1', title: 'x' })).status).toBe(403);
    const bad = await call('POST', '/shortlists', 'architect', { specId: '', title: '', extra: 1 });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body)).toMatch(/unknown field\(s\): extra/);
    expect((await call('POST', '/shortlists', 'architect', { specId: 'nope', title: 'x' })).status).toBe(404);
  });

  it('freezes candidates with the full engine result and versions; engineers may propose, only the owner removes', async () => {
    const { id, candidates } = await draftWith(['two-switch', 'active-clamp']);
    const proposed = await call('POST', `/shortlists/${id}/candidates`, 'engineer', { scheme: 'rcd-clamp', note: 'cheapest clamp' });
    expect(proposed.status).toBe(201);
    expect(proposed.body.result.scheme).toBe('rcd-clamp');
    expect(typeof proposed.body.engineVersion).toBe('string');
    expect(proposed.body.specVersion).toBeGreaterThanOrEqual(1);
    expect((await call('POST', `/shortlists/${id}/candidates`, 'sales', { scheme: 'rcd-clamp' })).status).toBe(403);
    expect((await call('POST', `/shortlists/${id}/candidates`, 'architect', { scheme: 'flyback' })).status).toBe(400);
    expect((await call('DELETE', `/shortlists/${id}/candidates/${proposed.body.id}`, 'engineer')).status).toBe(403);
    expect((await call('DELETE', `/shortlists/${id}/candidates/${proposed.body.id}`, 'architect')).status).toBe(200);
    expect((await call('DELETE', `/shortlists/${id}/candidates/${proposed.body.id}`, 'architect')).status).toBe(404);
    const view = await call('GET', `/shortlists/${id}`, 'engineer');
    expect(view.body.candidates.map((c: { id: string }) => c.id)).toEqual(candidates);
    expect(view.body.candidates[0].result.switchPeakV).toBeGreaterThan(0);
    expect(view.body.tally).toBeUndefined();
  });

  it('opening needs the owner, two candidates, a future deadline and eligible voters; mails the voters', async () => {
    const one = await draftWith(['two-switch']);
    expect((await call('POST', `/shortlists/${one.id}/open`, 'architect', { deadline: inTwoDays(), voterIds: ['demo-engineer'] })).status).toBe(409);
    const { id } = await draftWith(['two-switch', 'active-clamp']);
    expect((await call('POST', `/shortlists/${id}/open`, 'engineer', { deadline: inTwoDays(), voterIds: ['demo-engineer'] })).status).toBe(403);
    expect((await call('POST', `/shortlists/${id}/open`, 'architect', { deadline: '2020-01-01T00:00:00Z', voterIds: ['demo-engineer'] })).status).toBe(400);
    expect((await call('POST', `/shortlists/${id}/open`, 'architect', { deadline: 'tomorrow', voterIds: ['demo-engineer'] })).status).toBe(400);
    const salesVoter = await call('POST', `/shortlists/${id}/open`, 'architect', { deadline: inTwoDays(), voterIds: ['demo-sales'] });
    expect(salesVoter.status).toBe(400);
    expect(salesVoter.body.error).toMatch(/engineers or architects/);
    const opened = await call('POST', `/shortlists/${id}/open`, 'architect', { deadline: inTwoDays(), voterIds: ['demo-engineer', 'demo-engineer2'] });
    expect(opened.status).toBe(200);
    expect(opened.body).toMatchObject({ status: 'voting', invited: 2, mailed: 2 });
    const outbox = await call('GET', '/outbox', 'admin');
    const mails = outbox.body.messages.filter((m: { relatedId: string }) => m.relatedId === id);
    expect(mails.map((m: { to: string }) => m.to).sort()).toEqual(['engineer2@resetwise.example', 'engineer@resetwise.example']);
    expect(mails[0].text).toContain(`/shortlists/${id}`);
    expect((await call('POST', `/shortlists/${id}/candidates`, 'architect', { scheme: 'rcd-clamp' })).status).toBe(409);
  });

  it('ballots: only invited voters, every candidate exactly once, concerns need reasons; results hidden until you vote', async () => {
    const { id, candidates: [a, b, c] } = await draftWith(['two-switch', 'active-clamp', 'tertiary-winding']);
    await call('POST', `/shortlists/${id}/open`, 'architect', { deadline: inTwoDays(), voterIds: ['demo-engineer', 'demo-engineer2'] });
    const ballot = { ranking: [a, b, c], concerns: [{ candidateId: c, reason: 'bifilar reset winding at 150 V between turns' }], comment: 'two-switch is simplest' };
    expect((await call('PUT', `/shortlists/${id}/ballot`, 'sales', ballot)).status).toBe(403);
    expect((await call('PUT', `/shortlists/${id}/ballot`, 'engineer3', ballot)).status).toBe(403);
    expect((await call('PUT', `/shortlists/${id}/ballot`, 'engineer', { ...ballot, ranking: [a, b] })).status).toBe(400);
    expect((await call('PUT', `/shortlists/${id}/ballot`, 'engineer', { ...ballot, ranking: [a, a, b] })).status).toBe(400);
    expect((await call('PUT', `/shortlists/${id}/ballot`, 'engineer', { ...ballot, ranking: [a, b, 'zzz'] })).status).toBe(400);
    expect((await call('PUT', `/shortlists/${id}/ballot`, 'engineer', { ...ballot, concerns: [{ candidateId: c, reason: '' }] })).status).toBe(400);
    expect((await call('GET', `/shortlists/${id}`, 'engineer')).body.tally).toBeUndefined();
    const cast = await call('PUT', `/shortlists/${id}/ballot`, 'engineer', ballot);
    expect(cast.status).toBe(201);
    const mine = await call('GET', `/shortlists/${id}`, 'engineer');
    expect(mine.body.tally.ballots).toBe(1);
    expect((await call('GET', `/shortlists/${id}`, 'engineer2')).body.tally).toBeUndefined();
    expect((await call('GET', `/shortlists/${id}`, 'architect')).body.tally).toBeUndefined();
    const changed = await call('PUT', `/shortlists/${id}/ballot`, 'engineer', { ...ballot, ranking: [b, a, c] });
    expect(changed.status).toBe(200);
    expect(changed.body.changed).toBe(true);
    await call('PUT', `/shortlists/${id}/ballot`, 'engineer2', { ranking: [a, c, b], concerns: [], comment: '' });
    expect((await call('POST', `/shortlists/${id}/decision`, 'architect', { candidateId: a, rationale: 'too early to decide' })).status).toBe(409);
    expect((await call('POST', `/shortlists/${id}/close`, 'engineer', {})).status).toBe(403);
    expect((await call('POST', `/shortlists/${id}/close`, 'architect', {})).status).toBe(200);
    expect((await call('PUT', `/shortlists/${id}/ballot`, 'engineer', ballot)).status).toBe(409);
    const closed = await call('GET', `/shortlists/${id}`, 'engineer3');
    // Borda with 3 candidates: 2, 1, 0 points. engineer: b > a > c; engineer2: a > c > b.
    expect(closed.body.tally).toEqual({
      ballots: 2,
      candidates: [
        { candidateId: a, borda: 3, firstPreferences: 1, concerns: [] },
        { candidateId: b, borda: 2, firstPreferences: 1, concerns: [] },
        { candidateId: c, borda: 1, firstPreferences: 0, concerns: [{ voterName: 'Priya Raman', reason: 'bifilar reset winding at 150 V between turns' }] },
      ],
    });
    expect((await call('GET', `/shortlists/${id}`, 'sales')).status).toBe(403);
    expect((await call('POST', `/shortlists/${id}/decision`, 'engineer', { candidateId: a, rationale: 'two-switch: lowest stress' })).status).toBe(403);
    expect((await call('POST', `/shortlists/${id}/decision`, 'sales', { candidateId: a, rationale: 'two-switch: lowest stress' })).status).toBe(403);
    expect((await call('POST', `/shortlists/${id}/decision`, 'architect', { candidateId: a, rationale: 'short' })).status).toBe(400);
    expect((await call('POST', `/shortlists/${id}/decision`, 'architect', { candidateId: 'zzz', rationale: 'two-switch: lowest stress' })).status).toBe(400);
    expect((await call('POST', `/shortlists/${id}/decision`, 'architect', { candidateId: a, rationale: 'Two-switch: 100 V parts, no reset winding, best Borda.' })).status).toBe(200);
    const decided = await call('GET', `/shortlists/${id}`, 'sales');
    expect(decided.status).toBe(200);
    expect(decided.body.decision).toMatchObject({ candidateId: a, decidedBy: 'Mateo Ruiz' });
    expect(decided.body.history.map((h: { action: string }) => h.action)).toEqual([
      'shortlist.created', 'candidate.added', 'candidate.added', 'candidate.added', 'voting.opened',
      'ballot.cast', 'ballot.changed', 'ballot.cast', 'voting.closed', 'shortlist.decided',
    ]);
    expect((await call('POST', `/shortlists/${id}/withdraw`, 'architect', {})).status).toBe(409);
    const list = await call('GET', '/shortlists', 'sales');
    expect(list.body.shortlists.every((s: { status: string }) => s.status === 'decided')).toBe(true);
    expect(list.body.shortlists.map((s: { id: string }) => s.id)).toContain(id);
  });

  it('parallel ballots from every voter are all counted once', async () => {
    const { id, candidates } = await draftWith(['two-switch', 'active-clamp']);
    const voters = ['demo-engineer', 'demo-engineer2', 'demo-engineer3', 'demo-architect'];
    await call('POST', `/shortlists/${id}/open`, 'architect', { deadline: inTwoDays(), voterIds: voters });
    const roles = ['engineer', 'engineer2', 'engineer3', 'architect'];
    const replies = await Promise.all([...roles, ...roles].map((role, i) => call('PUT', `/shortlists/${id}/ballot`, role, { ranking: i % 2 ? candidates : [...candidates].reverse(), concerns: [], comment: '' })));
    expect(replies.every((r) => r.status === 200 || r.status === 201)).toBe(true);
    expect(replies.filter((r) => r.status === 201)).toHaveLength(4);
    await call('POST', `/shortlists/${id}/close`, 'architect', {});
    const tally = (await call('GET', `/shortlists/${id}`, 'architect')).body.tally;
    expect(tally.ballots).toBe(4);
    expect(tally.candidates.reduce((s: number, c: { borda: number }) => s + c.borda, 0)).toBe(4);
  });

  it('a candidate frozen before the spec changed is marked stale and re-evaluates into a new snapshot', async () => {
    const { id, candidates: [first] } = await draftWith(['two-switch', 'active-clamp']);
    const spec = await call('GET', '/specs/demo-spec-1', 'architect');
    const saved = await call('PUT', '/specs/demo-spec-1', 'architect', { version: spec.body.version, name: spec.body.name, customer: spec.body.customer, requirements: { ...spec.body.requirements, vinMaxV: 80 } });
    expect(saved.status).toBe(200);
    const stale = await call('GET', `/shortlists/${id}`, 'architect');
    expect(stale.body.candidates[0].staleReasons[0]).toMatch(/spec version/);
    expect((await call('POST', `/shortlists/${id}/candidates/${first}/reevaluate`, 'engineer', {})).status).toBe(403);
    expect((await call('POST', `/shortlists/${id}/candidates/${first}/reevaluate`, 'architect', {})).status).toBe(200);
    const fresh = await call('GET', `/shortlists/${id}`, 'architect');
    expect(fresh.body.candidates[0].staleReasons).toEqual([]);
    expect(fresh.body.candidates[0].snapshotCount).toBe(2);
    expect(fresh.body.candidates[0].result.switchPeakV).toBeCloseTo(80, 6); // two-switch: each switch sees Vin,max (Hart §7.5, from memory)
  });

  it('the OpenAPI document lists every shortlist route', async () => {
    const doc = await (await fetch(`${server.url}/api/v1/openapi.json`)).json();
    for (const route of ['/shortlists', '/shortlists/{id}', '/shortlists/{id}/candidates', '/shortlists/{id}/candidates/{candidateId}', '/shortlists/{id}/open', '/shortlists/{id}/ballot', '/shortlists/{id}/close', '/shortlists/{id}/decision']) {
      expect(doc.paths[route], route).toBeDefined();
    }
    expect(doc.paths['/shortlists/{id}/ballot'].put.requestBody.content['application/json'].schema.required).toEqual(expect.arrayContaining(['ranking']));
  });

  it('GET 404 for unknown shortlists; list filters by spec', async () => {
    expect((await call('GET', '/shortlists/nope', 'engineer')).status).toBe(404);
    const list = await call('GET', '/shortlists?specId=demo-spec-3', 'engineer');
    expect(list.status).toBe(200);
    expect(list.body.shortlists.every((s: { specId: string }) => s.specId === 'demo-spec-3')).toBe(true);
    expect((await call('GET', '/shortlists?colour=red', 'engineer')).status).toBe(400);
  });
});
