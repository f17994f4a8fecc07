import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { evaluate, type Comparison } from '../../src/engine';
import { demoSpecs } from '../../src/demo/specs';
import { verdictOf } from '../../src/lib/verdict';
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

async function newBrief(specId = 'demo-spec-1', role = 'sales', extra: Record<string, unknown> = {}) {
  const reply = await call('POST', '/api/v1/briefs', role, { specId, customerContact: 'Jana Holm, jana@nordlicht.example', ...extra });
  expect(reply.status).toBe(201);
  return reply.json();
}

/** Outbox rows as the admin's Outbox page lists them (the page is the only reader of the table over HTTP). */
async function outboxHtml(): Promise<string> {
  return (await call('GET', '/outbox', 'admin')).text();
}

describe('briefs: verdicts agree with the engine', () => {
  it.each(demoSpecs.map((s, i) => [`demo-spec-${i + 1}`, s] as const))('%s: one verdict per scheme, equal to verdictOf() of the engine result', async (specId, spec) => {
    const brief = await newBrief(specId);
    // The server's comparison of the saved set (workspace parts library), and the engine run here
    // with its built-in library: the brief must agree with the first, and the two agree today.
    const comparison: Comparison = (await (await call('GET', `/api/v1/specs/${specId}/comparison`, 'sales')).json()).comparison;
    const local = evaluate(spec.requirements);
    expect(comparison.results.map((r) => [r.scheme, verdictOf(r)])).toEqual(local.results.map((r) => [r.scheme, verdictOf(r)]));
    const expected = Object.fromEntries(comparison.results.map((r) => [r.scheme, verdictOf(r)]));
    const got = Object.fromEntries(brief.preview.verdicts.map((v: { scheme: string; verdict: string }) => [v.scheme, v.verdict]));
    expect(got).toEqual(expected);
    // The default recommendation is the ranking's best feasible scheme, with its own BOM cost.
    const best = comparison.ranking.find((id) => comparison.results.find((r) => r.scheme === id)!.feasible)!;
    expect(brief.preview.recommended.scheme).toBe(best);
    const bom = comparison.results.find((r) => r.scheme === best)!.bomCost;
    expect(brief.preview.cost.bomCost).toBeCloseTo(bom, 9);
    // Default contingency −10 %/+25 % (derived: the band is bom·0.9 … bom·1.25).
    expect(brief.preview.cost.low).toBeCloseTo(bom * 0.9, 9);
    expect(brief.preview.cost.high).toBeCloseTo(bom * 1.25, 9);
    expect(brief.preview.cost.annualVolume).toBe(spec.requirements.annualVolume);
    // A not-feasible verdict gives the engine's failing reason in words.
    for (const v of brief.preview.verdicts) {
      const result = comparison.results.find((r) => r.scheme === v.scheme)!;
      if (v.verdict === 'not-feasible') expect(v.reasons.join(' ')).toContain(result.findings.find((f) => f.severity === 'fail')!.message);
    }
  });

  it('states the requirement set in the customer\'s units', async () => {
    const brief = await newBrief('demo-spec-1');
    const lines = Object.fromEntries(brief.preview.requirements.map((l: { label: string; value: string }) => [l.label, l.value]));
    expect(lines['Input voltage']).toBe('36–75 V DC, nominal 48 V');
    expect(lines['Switching frequency']).toBe('250 kHz');
    expect(lines.Output).toBe('12 V at 12.5 A (150 W)');
    expect(lines['Annual volume']).toBe('20,000 units/year');
  });
});

describe('briefs: roles and validation', () => {
  it('401 signed out; every role lists and reads; engineers may not create, edit, send or share (403)', async () => {
    const brief = await newBrief();
    expect((await call('GET', '/api/v1/briefs')).status).toBe(401);
    expect((await call('GET', `/api/v1/briefs/${brief.id}`)).status).toBe(401);
    for (const role of ['admin', 'architect', 'engineer', 'sales']) {
      expect((await call('GET', `/api/v1/briefs?specId=demo-spec-1`, role)).status).toBe(200);
      expect((await call('GET', `/api/v1/briefs/${brief.id}`, role)).status).toBe(200);
    }
    expect((await call('POST', '/api/v1/briefs', 'engineer', { specId: 'demo-spec-1' })).status).toBe(403);
    expect((await call('PUT', `/api/v1/briefs/${brief.id}`, 'engineer', { title: 'x', customerName: 'y' })).status).toBe(403);
    expect((await call('POST', `/api/v1/briefs/${brief.id}/send`, 'engineer', { to: 'buyer@customer.example' })).status).toBe(403);
    expect((await call('POST', `/api/v1/briefs/${brief.id}/share`, 'engineer', {})).status).toBe(403);
    expect((await call('DELETE', `/api/v1/briefs/${brief.id}/share`, 'engineer')).status).toBe(403);
    expect((await call('POST', '/api/v1/briefs', 'architect', { specId: 'demo-spec-2' })).status).toBe(201);
    expect((await call('POST', '/api/v1/briefs', 'admin', { specId: 'demo-spec-3' })).status).toBe(201);
  });

  it('lists the briefs of one requirement set with ?specId=', async () => {
    const brief = await newBrief('demo-spec-3');
    const listed = await (await call('GET', '/api/v1/briefs?specId=demo-spec-3', 'engineer')).json();
    expect(listed.briefs.map((b: { id: string }) => b.id)).toContain(brief.id);
    expect(listed.briefs.every((b: { specId: string }) => b.specId === 'demo-spec-3')).toBe(true);
  });

  it('400 for invalid e-mail addresses, naming the address; nothing is sent or frozen', async () => {
    const brief = await newBrief();
    const before = await outboxHtml();
    const bad = await call('POST', `/api/v1/briefs/${brief.id}/send`, 'sales', { to: ['buyer@customer.example', 'not-an-address'] });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(await bad.json())).toContain('not-an-address is not a valid e-mail address');
    const badCc = await call('POST', `/api/v1/briefs/${brief.id}/send`, 'sales', { to: 'buyer@customer.example', cc: 'x@' });
    expect(badCc.status).toBe(400);
    expect((await call('POST', `/api/v1/briefs/${brief.id}/send`, 'sales', { to: [] })).status).toBe(400);
    expect((await call('POST', `/api/v1/briefs/${brief.id}/send`, 'sales', {})).status).toBe(400);
    expect((await (await call('GET', `/api/v1/briefs/${brief.id}`, 'sales')).json()).versions).toHaveLength(0);
    expect((await outboxHtml()).match(/data-message=/g)?.length ?? 0).toBe(before.match(/data-message=/g)?.length ?? 0);
  });

  it('400 for bad bodies: unknown spec, unknown field, infeasible recommendation, contingency out of range', async () => {
    expect((await call('POST', '/api/v1/briefs', 'sales', { specId: 'nope' })).status).toBe(400);
    expect(JSON.stringify(await (await call('POST', '/api/v1/briefs', 'sales', { specId: 'demo-spec-1', colour: 'red' })).json())).toMatch(/unknown field\(s\): colour/);
    const brief = await newBrief('demo-spec-2');
    const infeasible = brief.preview.verdicts.find((v: { verdict: string }) => v.verdict === 'not-feasible');
    expect(infeasible).toBeDefined();
    const base = { title: brief.title, customerName: brief.customerName };
    const reply = await call('PUT', `/api/v1/briefs/${brief.id}`, 'sales', { ...base, recommendedScheme: infeasible.scheme });
    expect(reply.status).toBe(400);
    expect((await reply.json()).fields[0].field).toBe('recommendedScheme');
    expect((await call('PUT', `/api/v1/briefs/${brief.id}`, 'sales', { ...base, contingencyHighPct: -5 })).status).toBe(400);
    expect((await call('PUT', `/api/v1/briefs/${brief.id}`, 'sales', { ...base, customerName: '' })).status).toBe(400);
    expect((await call('GET', '/api/v1/briefs/nope', 'sales')).status).toBe(404);
  });

  it('PUT saves the editable summary, recommendation and contingency; the preview follows', async () => {
    const brief = await newBrief('demo-spec-1');
    const reply = await call('PUT', `/api/v1/briefs/${brief.id}`, 'sales', {
      title: 'Can we build your 150 W brick?', customerName: 'Nordlicht Telecom (fictional)', customerContact: 'Jana Holm',
      summary: 'Yes, with the tertiary-winding reset.', recommendedScheme: 'tertiary-winding',
      contingencyLowPct: 5, contingencyHighPct: 40, risksText: '- Magnetics supplier not yet qualified', assumptionsText: 'Forced-air cooling at 1 m/s',
    });
    expect(reply.status).toBe(200);
    const saved = await reply.json();
    expect(saved.preview.summary).toBe('Yes, with the tertiary-winding reset.');
    expect(saved.preview.recommended).toMatchObject({ scheme: 'tertiary-winding', source: 'edited' });
    const bom = evaluate(demoSpecs[0]!.requirements).results.find((r) => r.scheme === 'tertiary-winding')!.bomCost;
    expect(saved.preview.cost.low).toBeCloseTo(bom * 0.95, 9);
    expect(saved.preview.cost.high).toBeCloseTo(bom * 1.4, 9);
    expect(saved.preview.risks.at(-1)).toBe('Magnetics supplier not yet qualified');
    expect(saved.preview.assumptions.at(-1)).toBe('Forced-air cooling at 1 m/s');
  });
});

describe('briefs: send and share', () => {
  it('a send freezes a version and produces exactly one captured message with both parts and a working link', async () => {
    const brief = await newBrief('demo-spec-2');
    const before = (await outboxHtml()).match(/data-message=/g)?.length ?? 0;
    const reply = await call('POST', `/api/v1/briefs/${brief.id}/send`, 'sales', { to: 'buyer@cobalt-ridge.example', cc: 'ops@cobalt-ridge.example', message: 'As discussed on the phone.' });
    expect(reply.status).toBe(201);
    const sent = await reply.json();
    expect(sent).toMatchObject({ version: 1, sentTo: ['buyer@cobalt-ridge.example'], cc: ['ops@cobalt-ridge.example'], mail: { status: 'captured' } });
    const token = new URL(sent.share.url).pathname.split('/').pop()!;
    expect(Buffer.from(token, 'base64url').length).toBeGreaterThanOrEqual(16); // ≥ 128 bits
    const html = await outboxHtml();
    expect(html.match(/data-message=/g)?.length ?? 0).toBe(before + 1);
    const briefMails = html.split('data-message="').slice(1).filter((chunk) => chunk.includes(sent.share.url));
    expect(briefMails).toHaveLength(1);
    expect(briefMails[0]).toContain('to buyer@cobalt-ridge.example, cc ops@cobalt-ridge.example');
    expect(briefMails[0]).toContain('captured');
    // Plain-text part with the link, and the HTML part (shown as source) with the link as an anchor.
    expect(briefMails[0]).toMatch(new RegExp(`Plain-text part[\\s\\S]*Read the full brief \\(version 1\\) here: ${sent.share.url}`));
    expect(briefMails[0]).toContain(`HTML part`);
    expect(briefMails[0]).toContain(`&lt;a href=&quot;${sent.share.url}&quot;`);
    expect(briefMails[0]).toContain('As discussed on the phone.');
    // The link works signed out and shows the frozen version.
    const page = await fetch(sent.share.url);
    expect(page.status).toBe(200);
    const text = await page.text();
    expect(text).toContain('Cobalt Ridge Datacenters (fictional)');
    expect(text).toContain('data-brief-issue="1"');
    expect(text).toContain('Early estimate, not a design');
    expect(text).toContain('hazardous voltages');
    const after = await (await call('GET', `/api/v1/briefs/${brief.id}`, 'engineer')).json();
    expect(after.versions).toHaveLength(1);
    expect(after.versions[0]).toMatchObject({ version: 1, sentTo: 'buyer@cobalt-ridge.example, ops@cobalt-ridge.example', sentBy: 'Daniel Brandt' });
    expect(after.versions[0].shares[0].views).toBe(1);
  });

  it('earlier versions stay readable after edits and later sends', async () => {
    const brief = await newBrief('demo-spec-3');
    await call('POST', `/api/v1/briefs/${brief.id}/send`, 'sales', { to: 'a@tessaro.example' });
    await call('PUT', `/api/v1/briefs/${brief.id}`, 'sales', { title: brief.title, customerName: brief.customerName, summary: 'Second thoughts.' });
    const second = await (await call('POST', `/api/v1/briefs/${brief.id}/send`, 'sales', { to: 'a@tessaro.example' })).json();
    expect(second.version).toBe(2);
    const got = await (await call('GET', `/api/v1/briefs/${brief.id}`, 'sales')).json();
    expect(got.versions.map((v: { version: number }) => v.version)).toEqual([2, 1]);
    expect(got.versions[0].content.summary).toBe('Second thoughts.');
    expect(got.versions[1].content.summary).toBe(brief.preview.summary);
  });

  it('the share page works signed out, exposes nothing else, and fails after revoke', async () => {
    const brief = await newBrief('demo-spec-1');
    const shared = await (await call('POST', `/api/v1/briefs/${brief.id}/share`, 'architect', { expiresInDays: 7 })).json();
    expect(shared).toMatchObject({ version: 1, frozeNewVersion: true });
    expect(Date.parse(shared.share.expiresAt) - Date.now()).toBeGreaterThan(6.9 * 86_400_000);
    const again = await (await call('POST', `/api/v1/briefs/${brief.id}/share`, 'architect')).json();
    expect(again).toMatchObject({ version: 1, frozeNewVersion: false });
    expect(Date.parse(again.share.expiresAt) - Date.now()).toBeGreaterThan(29.9 * 86_400_000); // 30 days by default
    const page = await fetch(shared.share.url, { redirect: 'manual' });
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('Nordlicht Telecom (fictional)');
    // Nothing else is reachable: no links, no scripts, no navigation, no other requirement set.
    expect(html).not.toMatch(/<a\s/i);
    expect(html).not.toMatch(/<script/i);
    expect(html).not.toMatch(/<nav/i);
    expect(html).not.toContain('Cobalt Ridge');
    expect(html).not.toContain(brief.id);
    expect(page.headers.get('cache-control')).toBe('no-store');
    expect(page.headers.get('set-cookie')).toBeNull();
    // The token is no key to the API.
    const token = new URL(shared.share.url).pathname.split('/').pop()!;
    for (const headers of [{ cookie: `rw_session=${token}` }, { authorization: `Bearer ${token}` }] as Record<string, string>[]) {
      expect((await fetch(`${server.url}/api/v1/briefs/${brief.id}`, { headers })).status).toBe(401);
      expect((await fetch(`${server.url}/api/v1/specs`, { headers })).status).toBe(401);
    }
    // A guessed token of the right shape finds nothing.
    expect((await fetch(`${server.url}/share/${'A'.repeat(43)}`)).status).toBe(404);
    expect((await fetch(`${server.url}/share/short`)).status).toBe(404);
    // Revoke: both links stop working at once.
    const revoked = await (await call('DELETE', `/api/v1/briefs/${brief.id}/share`, 'sales')).json();
    expect(revoked.revoked).toBe(2);
    for (const url of [shared.share.url, again.share.url]) {
      const gone = await fetch(url);
      expect(gone.status).toBe(410);
      const body = await gone.text();
      expect(body).toContain('withdrawn');
      expect(body).not.toContain('Nordlicht');
    }
    const views = (await (await call('GET', `/api/v1/briefs/${brief.id}`, 'sales')).json()).versions[0].shares;
    expect(views.map((s: { views: number }) => s.views).sort()).toEqual([0, 1]);
  });

  it('400 for an expiry out of range', async () => {
    const brief = await newBrief();
    expect((await call('POST', `/api/v1/briefs/${brief.id}/share`, 'sales', { expiresInDays: 0 })).status).toBe(400);
    expect((await call('POST', `/api/v1/briefs/${brief.id}/share`, 'sales', { expiresInDays: 1.5 })).status).toBe(400);
  });

  it('pages: engineers read the brief page without editor, send or share', async () => {
    const brief = await newBrief();
    const engineer = await (await call('GET', `/briefs/${brief.id}`, 'engineer')).text();
    expect(engineer).toContain('data-brief-document');
    expect(engineer).toContain('data-read-only');
    expect(engineer).not.toContain('data-send-form');
    const sales = await (await call('GET', `/briefs/${brief.id}`, 'sales')).text();
    expect(sales).toContain('data-send-form');
    expect((await fetch(`${server.url}/briefs/${brief.id}`, { redirect: 'manual' })).status).toBe(302);
  });
});

describe('briefs in the OpenAPI document', () => {
  it('lists every briefs route with its methods', async () => {
    const doc = await (await fetch(`${server.url}/api/v1/openapi.json`)).json();
    expect(Object.keys(doc.paths['/briefs']).sort()).toEqual(['get', 'post']);
    expect(Object.keys(doc.paths['/briefs/{id}']).sort()).toEqual(['get', 'put']);
    expect(Object.keys(doc.paths['/briefs/{id}/send'])).toEqual(['post']);
    expect(Object.keys(doc.paths['/briefs/{id}/share']).sort()).toEqual(['delete', 'post']);
    expect(doc.paths['/briefs/{id}/send'].post.requestBody.content['application/json'].schema.required).toEqual(['to']);
  });
});
