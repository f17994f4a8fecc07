import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { signIn, startServer, type RunningServer } from '../helpers/server';

/**
 * Generated bad input for every JSON endpoint and every upload in the OpenAPI document: no
 * reply may be a 5xx, every refusal is JSON with a plain message, and a refused request
 * writes nothing (the workspace's state is the same before and after).
 */
let server: RunningServer;
let admin: string;
const ids: Record<string, string> = {};

beforeAll(async () => {
  server = await startServer();
  admin = await signIn(server.url, 'admin@resetwise.example');
  const post = async (path: string, body: unknown) =>
    (await fetch(`${server.url}${path}`, { method: 'POST', headers: { 'content-type': 'application/json', origin: server.url, cookie: admin }, body: JSON.stringify(body) })).json();
  ids.shortlist = (await post('/api/v1/shortlists', { specId: 'demo-spec-1', title: 'Fuzz' })).id;
  ids.candidate = (await post(`/api/v1/shortlists/${ids.shortlist}/candidates`, { scheme: 'two-switch' })).id;
  ids.brief = (await post('/api/v1/briefs', { specId: 'demo-spec-1' })).id;
});
afterAll(async () => {
  await server?.stop();
});

const get = async (path: string) => (await fetch(`${server.url}${path}`, { headers: { cookie: admin } })).text();
/** Everything a stray write could change, read through the API. */
const fingerprint = async () =>
  (await Promise.all([
    '/api/v1/specs?archived=1', '/api/v1/users', '/api/v1/shortlists', `/api/v1/shortlists/${ids.shortlist}`, '/api/v1/parts/history',
    '/api/v1/briefs?specId=demo-spec-1', `/api/v1/briefs/${ids.brief}`,
  ].map(get))).join('\n');

const fill = (path: string) => path.replace('{id}', (p) => p && (path.startsWith('/shortlists') ? ids.shortlist! : path.startsWith('/briefs') ? ids.brief! : path.startsWith('/users') ? 'demo-engineer3' : path.startsWith('/parts') ? 'demo-sr-30v-a' : 'demo-spec-1')).replace('{candidateId}', ids.candidate!);

const nasty = fc.oneof(
  fc.double(), fc.integer({ min: -1e12, max: 1e12 }), fc.constantFrom('NaN', 'Infinity', '-Infinity', '1e309', '-0', '', ' ', '48 V', '=cmd|calc', '<script>x</script>'),
  fc.string({ unit: 'binary', maxLength: 40 }), fc.constant(null), fc.boolean(), fc.array(fc.integer(), { maxLength: 4 }), fc.object({ maxDepth: 2 }),
);

/** Bodies: anything; objects with the endpoint's own field names holding wrong values; deep nesting; 1 MB strings. */
function bodies(fields: string[]): fc.Arbitrary<string> {
  const known = fields.length > 0 ? fc.dictionary(fc.constantFrom(...fields), nasty, { maxKeys: fields.length }) : fc.object();
  return fc.oneof(
    { weight: 3, arbitrary: known.map((o) => JSON.stringify(o)) },
    { weight: 2, arbitrary: fc.anything().map((v) => JSON.stringify(v) ?? 'null') },
    { weight: 1, arbitrary: fc.integer({ min: 50, max: 5000 }).map((depth) => '['.repeat(depth) + ']'.repeat(depth)) },
    { weight: 1, arbitrary: fc.constantFrom(...fields, 'name').map((key) => JSON.stringify({ [key]: 'x'.repeat(1_000_000) })) },
    { weight: 1, arbitrary: fc.string({ unit: 'binary', maxLength: 200 }) },
  );
}

interface Target { method: string; path: string; fields: string[]; kind: 'json' | 'multipart' }
let targets: Target[] = [];

describe('fuzzed input', () => {
  it('finds every JSON endpoint and upload in the API document', async () => {
    const doc = await (await fetch(`${server.url}/api/v1/openapi.json`)).json();
    for (const [path, item] of Object.entries<Record<string, any>>(doc.paths)) {
      for (const [method, op] of Object.entries<any>(item)) {
        const content = op?.requestBody?.content ?? {};
        if (path === '/auth/sign-out') continue;
        if (content['application/json']) targets.push({ method: method.toUpperCase(), path, fields: Object.keys(content['application/json'].schema?.properties ?? {}), kind: 'json' });
        if (content['multipart/form-data']) targets.push({ method: method.toUpperCase(), path, fields: [], kind: 'multipart' });
      }
    }
    targets = targets.sort((a, b) => `${a.path} ${a.method}`.localeCompare(`${b.path} ${b.method}`));
    expect(targets.filter((t) => t.kind === 'json').length).toBeGreaterThanOrEqual(20);
    expect(targets.filter((t) => t.kind === 'multipart').length).toBeGreaterThanOrEqual(2);
  });

  it('JSON endpoints: no 5xx, JSON errors with a message, nothing written when refused', async () => {
    const counts: string[] = [];
    for (const target of targets.filter((t) => t.kind === 'json')) {
      const before = await fingerprint();
      let tried = 0;
      let accepted = 0;
      await fc.assert(
        fc.asyncProperty(bodies(target.fields), async (body) => {
          tried++;
          const response = await fetch(`${server.url}/api/v1${fill(target.path)}`, {
            method: target.method, headers: { 'content-type': 'application/json', origin: server.url, cookie: admin }, body,
          });
          expect(response.status, `${target.method} ${target.path} with ${body.slice(0, 200)}`).toBeLessThan(500);
          const reply = await response.json();
          if (response.status >= 400) expect(typeof reply.error, `${target.method} ${target.path}`).toBe('string');
          else accepted++;
        }),
        { numRuns: 30, seed: 4242, endOnFailure: true },
      );
      if (accepted === 0) expect(await fingerprint(), `${target.method} ${target.path} wrote something while refusing`).toBe(before);
      counts.push(`${target.method} /api/v1${target.path}: ${tried}${accepted ? ` (${accepted} accepted)` : ''}`);
    }
    console.log(`Fuzzed JSON inputs per endpoint:\n  ${counts.join('\n  ')}`);
  }, 300_000);

  it('uploads: empty, truncated, binary, oversized and random files are refused cleanly', async () => {
    const counts: string[] = [];
    const fixed: [string, Uint8Array, string][] = [
      ['empty.csv', new Uint8Array(0), 'text/csv'],
      ['truncated.csv', new TextEncoder().encode('category,id,status,vdsV,idA,rdsOnOhm\nmosfets,demo-x,preferred,6'), 'text/csv'],
      ['binary.csv', Uint8Array.from({ length: 4096 }, (_, i) => (i * 7919) % 256), 'application/octet-stream'],
      ['big.csv', new Uint8Array(2 * 1024 * 1024 + 10).fill(65), 'text/csv'],
      ['spec.json', new TextEncoder().encode('{"vinMinV": "36 V", "vinMaxV": '), 'application/json'],
    ];
    for (const target of targets.filter((t) => t.kind === 'multipart')) {
      const before = await fingerprint();
      let tried = 0;
      const send = async (name: string, bytes: Uint8Array<ArrayBuffer> | Uint8Array, type: string) => {
        tried++;
        const form = new FormData();
        form.append('file', new Blob([new Uint8Array(bytes)], { type }), name);
        const response = await fetch(`${server.url}/api/v1${fill(target.path)}`, { method: target.method, headers: { origin: server.url, cookie: admin }, body: form });
        expect(response.status, `${target.path} with ${name} (${bytes.length} bytes)`).toBeGreaterThanOrEqual(400);
        expect(response.status, `${target.path} with ${name}`).toBeLessThan(500);
        expect(typeof (await response.json()).error).toBe('string');
      };
      for (const [name, bytes, type] of fixed) await send(name, bytes, type);
      await fc.assert(fc.asyncProperty(fc.uint8Array({ maxLength: 3000 }), fc.constantFrom('x.csv', 'x.json', 'x.bin'), async (bytes, name) => send(name, bytes, 'application/octet-stream')), { numRuns: 20, seed: 7 });
      // The same, without any file part at all.
      tried++;
      const none = await fetch(`${server.url}/api/v1${fill(target.path)}`, { method: target.method, headers: { origin: server.url, cookie: admin }, body: new FormData() });
      expect(none.status).toBe(400);
      expect(await fingerprint(), `${target.path} wrote something while refusing`).toBe(before);
      counts.push(`${target.method} /api/v1${target.path}: ${tried}`);
    }
    console.log(`Fuzzed uploads per endpoint:\n  ${counts.join('\n  ')}`);
  }, 300_000);
});
