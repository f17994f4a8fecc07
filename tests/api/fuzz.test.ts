import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { signIn, startServer, type RunningServer } from '../helpers/server';
import { listRoutes } from '../helpers/routes';
import { rawRequest, streamBody } from '../helpers/raw-http';

/**
 * Generated bad input for every JSON endpoint and every upload in the OpenAPI document, every [param] route and
 * every query string: no reply may be a 5xx, every API refusal is JSON with a plain message, and a refused
 * request writes nothing (the workspace's state is the same before and after). What attackers send is in the
 * generators: U+0000 and the other control characters in values, keys, ids and query strings; nesting 10,
 * 1,000 and 100,000 deep; huge bodies, declared and chunked. The last test prints how many requests were sent.
 */
let server: RunningServer;
let admin: string;
const ids: Record<string, string> = {};
/** Every request this file sends, and the replies by status class. */
const sent = { total: 0, byClass: {} as Record<string, number> };
const count = (status: number): void => {
  sent.total++;
  const key = `${Math.floor(status / 100)}xx`;
  sent.byClass[key] = (sent.byClass[key] ?? 0) + 1;
};

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

/** Text with the characters PostgreSQL and terminals choke on. */
const CONTROLS = ['\u0000', 'a\u0000b', '\u0001', '\u0008', '\u000b', '\u001b[31m', '\u007f', '\u0085', '\u009f', 'tab\there', 'line\nbreak', '\r\n', '\ud800', '\uffff'];
const controlled = fc.oneof(fc.constantFrom(...CONTROLS), fc.tuple(fc.string({ maxLength: 8 }), fc.constantFrom(...CONTROLS), fc.string({ maxLength: 8 })).map((parts) => parts.join('')));
/** Nesting of arrays or objects `levels` deep, as JSON text. */
const deepText = (levels: number, kind: 'array' | 'object'): string => (kind === 'array' ? '['.repeat(levels) + ']'.repeat(levels) : '{"a":'.repeat(levels) + '1' + '}'.repeat(levels));
const DEPTHS = [10, 1_000, 100_000] as const;

/** A route pattern of src/pages with the fixture's ids in place of its [params]. */
const concreteRoute = (pattern: string): string => {
  const named = pattern.replace('[id]', '{id}').replace('[candidateId]', '{candidateId}').replace('[token]', 'not-a-real-token-0123456789abcdef');
  return named.startsWith('/api/v1') ? `/api/v1${fill(named.slice('/api/v1'.length))}` : fill(named);
};

const nasty = fc.oneof(
  fc.double(), fc.integer({ min: -1e12, max: 1e12 }), fc.constantFrom('NaN', 'Infinity', '-Infinity', '1e309', '-0', '', ' ', '48 V', '=cmd|calc', '<script>x</script>'),
  fc.string({ unit: 'binary', maxLength: 40 }), fc.constant(null), fc.boolean(), fc.array(fc.integer(), { maxLength: 4 }), fc.object({ maxDepth: 2 }),
  controlled, fc.array(controlled, { maxLength: 3 }), fc.dictionary(controlled, fc.string({ maxLength: 4 }), { maxKeys: 2 }),
);

/**
 * Bodies: anything; objects with the endpoint's own field names holding wrong values, control characters and
 * deep nesting (10, 1,000, 100,000 levels, also inside `requirements` where a route has it); 1 MB strings.
 */
function bodies(fields: string[]): fc.Arbitrary<string> {
  const known = fields.length > 0 ? fc.dictionary(fc.constantFrom(...fields), nasty, { maxKeys: fields.length }) : fc.object();
  const keys = [...fields, 'name'];
  return fc.oneof(
    { weight: 3, arbitrary: known.map((o) => JSON.stringify(o)) },
    { weight: 2, arbitrary: fc.anything().map((v) => JSON.stringify(v) ?? 'null') },
    { weight: 1, arbitrary: fc.integer({ min: 50, max: 5000 }).map((depth) => '['.repeat(depth) + ']'.repeat(depth)) },
    { weight: 1, arbitrary: fc.tuple(fc.constantFrom(...keys), fc.constantFrom(...DEPTHS), fc.constantFrom('array', 'object') as fc.Arbitrary<'array' | 'object'>).map(([key, levels, kind]) => `{${JSON.stringify(key)}:${deepText(levels, kind)}}`) },
    { weight: 1, arbitrary: fc.tuple(fc.constantFrom(...DEPTHS), fc.constantFrom('array', 'object') as fc.Arbitrary<'array' | 'object'>).map(([levels, kind]) => `{"name":"x","requirements":{"vinMinV":${deepText(levels, kind)}}}`) },
    { weight: 1, arbitrary: fc.tuple(fc.constantFrom(...keys), controlled).map(([key, text]) => JSON.stringify({ [key]: text })) },
    { weight: 1, arbitrary: fc.tuple(controlled, nasty).map(([key, value]) => JSON.stringify({ [key]: value })) },
    { weight: 1, arbitrary: fc.constantFrom(...keys).map((key) => JSON.stringify({ [key]: 'x'.repeat(1_000_000) })) },
    { weight: 1, arbitrary: fc.string({ unit: 'binary', maxLength: 200 }) },
  );
}

/** A path segment as an attacker writes it: percent-encoded controls, overlong and broken UTF-8, traversal, huge. */
const nastySegment = fc.oneof(
  fc.constantFrom('%00', 'a%00', '%00a', '%01', '%1B%5B31m', '%7F', '%C2%85', '%C0%80', '%E0%A4%A', '%FF', '%', '%25', '..%2F..%2Fetc%2Fpasswd', '%2e%2e', 'x'.repeat(5000), '%F0%9F%94%8C', 'demo-spec-1%00', '%0D%0ASet-Cookie:%20x=1'),
  fc.string({ unit: 'grapheme', maxLength: 30 }).map((text) => encodeURIComponent(text) || 'x'),
  controlled.map((text) => { try { return encodeURIComponent(text); } catch { return '%00'; } }),
);

/** A query string of the same. */
const nastyQuery = fc.oneof(
  fc.tuple(fc.constantFrom('specId', 'scheme', 'vin', 'archived', 'category', 'version', 'dryRun', 'shareId', 'next', 'error'), nastySegment).map(([key, value]) => `${key}=${value}`),
  fc.tuple(nastySegment, nastySegment).map(([key, value]) => `${key}=${value}`),
  fc.constantFrom('a%00=1', '%00', '=&=&', 'specId=1&specId=2', '?'.repeat(50), 'x=' + 'y'.repeat(17_000)),
);

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
          count(response.status);
          expect(response.status, `${target.method} ${target.path} with ${body.slice(0, 200)}`).toBeLessThan(500);
          const reply = await response.json();
          if (response.status >= 400) expect(typeof reply.error, `${target.method} ${target.path}`).toBe('string');
          else accepted++;
        }),
        { numRuns: 300, seed: 4242, endOnFailure: true },
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
      ['nul.csv', new TextEncoder().encode('category,id\nmosfets,a\u0000b\n'), 'text/csv'],
      ['escape.csv', new TextEncoder().encode('category,id,description\nmosfets,demo-x,\u001b[31mred\n'), 'text/csv'],
      ['deep.json', new TextEncoder().encode(deepText(100_000, 'array')), 'application/json'],
      ['deep-field.json', new TextEncoder().encode(`{"vinMinV":${deepText(5_000, 'object')}}`), 'application/json'],
    ];
    for (const target of targets.filter((t) => t.kind === 'multipart')) {
      const before = await fingerprint();
      let tried = 0;
      const send = async (name: string, bytes: Uint8Array<ArrayBuffer> | Uint8Array, type: string) => {
        tried++;
        const form = new FormData();
        form.append('file', new Blob([new Uint8Array(bytes)], { type }), name);
        const response = await fetch(`${server.url}/api/v1${fill(target.path)}`, { method: target.method, headers: { origin: server.url, cookie: admin }, body: form });
        count(response.status);
        expect(response.status, `${target.path} with ${name} (${bytes.length} bytes)`).toBeGreaterThanOrEqual(400);
        expect(response.status, `${target.path} with ${name}`).toBeLessThan(500);
        expect(typeof (await response.json()).error).toBe('string');
      };
      for (const [name, bytes, type] of fixed) await send(name, bytes, type);
      await fc.assert(fc.asyncProperty(fc.uint8Array({ maxLength: 3000 }), fc.constantFrom('x.csv', 'x.json', 'x.bin'), async (bytes, name) => send(name, bytes, 'application/octet-stream')), { numRuns: 20, seed: 7 });
      // The same, without any file part at all.
      tried++;
      const none = await fetch(`${server.url}/api/v1${fill(target.path)}`, { method: target.method, headers: { origin: server.url, cookie: admin }, body: new FormData() });
      count(none.status);
      expect(none.status).toBe(400);
      expect(await fingerprint(), `${target.path} wrote something while refusing`).toBe(before);
      counts.push(`${target.method} /api/v1${target.path}: ${tried}`);
    }
    console.log(`Fuzzed uploads per endpoint:\n  ${counts.join('\n  ')}`);
  }, 300_000);

  /** Every route with a [param]: each param replaced by generated nasty segments, with every method the route has. */
  it('path parameters of every [param] route: no 5xx, API refusals in JSON, nothing written', async () => {
    const routes = listRoutes().filter((r) => r.pattern.includes('[') && r.key !== 'POST /api/v1/auth/sign-out');
    expect(routes.length).toBeGreaterThanOrEqual(20);
    const before = await fingerprint();
    const counts: string[] = [];
    for (const route of routes) {
      let tried = 0;
      await fc.assert(
        fc.asyncProperty(nastySegment, async (segment) => {
          tried++;
          const path = route.pattern.replace(/\[[^\]]+\]/g, segment);
          const body = route.method === 'GET' ? undefined : '{"__probe":true}';
          const reply = await rawRequest(server.url, path, { method: route.method, headers: { origin: server.url, cookie: admin, ...(body ? { 'content-type': 'application/json' } : {}) }, ...(body ? { body } : {}) });
          count(reply.status);
          expect(reply.status, `${route.method} ${path.slice(0, 200)}`).toBeLessThan(500);
          if (path.startsWith('/api/') && reply.status >= 400) expect(typeof JSON.parse(reply.text).error, `${route.method} ${path.slice(0, 200)}`).toBe('string');
        }),
        { numRuns: 120, seed: 1616, endOnFailure: true },
      );
      counts.push(`${route.key}: ${tried}`);
    }
    expect(await fingerprint(), 'a path-parameter probe wrote something').toBe(before);
    console.log(`Fuzzed path parameters per route:\n  ${counts.join('\n  ')}`);
  }, 600_000);

  it('query strings of every GET route: no 5xx, API refusals in JSON', async () => {
    // GET /500 is the error page itself: its 500 is the page, not a failure.
    const routes = listRoutes().filter((r) => r.method === 'GET' && r.pattern !== '/500');
    let tried = 0;
    for (const route of routes) {
      await fc.assert(
        fc.asyncProperty(nastyQuery, async (query) => {
          tried++;
          const concrete = concreteRoute(route.pattern);
          const reply = await rawRequest(server.url, `${concrete}?${query}`, { headers: { cookie: admin } });
          count(reply.status);
          expect(reply.status, `GET ${concrete}?${query.slice(0, 200)}`).toBeLessThan(500);
          if (concrete.startsWith('/api/') && reply.status >= 400) expect(typeof JSON.parse(reply.text).error).toBe('string');
        }),
        { numRuns: 40, seed: 1717, endOnFailure: true },
      );
    }
    console.log(`Fuzzed query strings: ${tried} over ${routes.length} GET routes`);
  }, 600_000);

  it('huge bodies, declared and chunked, on every write route: 413 while streaming, before any route work', async () => {
    const writes = listRoutes().filter((r) => r.method !== 'GET' && r.key !== 'POST /api/v1/auth/sign-out');
    const chunk = Buffer.alloc(64 * 1024, 0x20);
    const rssMiB = (): number => Number(/VmRSS:\s+(\d+)/.exec(readFileSync(`/proc/${server.pid}/status`, 'utf8'))![1]) / 1024;
    const rssBefore = rssMiB();
    for (const route of writes) {
      const path = concreteRoute(route.pattern);
      for (const who of [admin, undefined]) {
        const headers = { 'content-type': 'application/json', origin: server.url, ...(who ? { cookie: who } : {}) };
        const streamed = await streamBody(server.url, path, headers, 128 * 1024 * 1024, chunk);
        count(streamed.status);
        expect(streamed.status, `${route.key} chunked`).toBe(413);
        // The refusal arrives long before the end of the body (what the client pushed meanwhile, the server dropped).
        expect(streamed.sentBeforeReply, `${route.key}: the server read the whole body before refusing it`).toBeLessThan(128 * 1024 * 1024);
        const declared = await rawRequest(server.url, path, { method: route.method, headers: { ...headers, 'content-length': String(500 * 1024 * 1024) } }).catch(() => null);
        if (declared) {
          count(declared.status);
          expect(declared.status, `${route.key} declared`).toBe(413);
        }
      }
    }
    const grown = rssMiB() - rssBefore;
    console.log(`Huge bodies: ${writes.length * 2} chunked bodies of up to 128 MB and ${writes.length * 2} declared 500 MB ones refused; server memory ${grown >= 0 ? '+' : ''}${grown.toFixed(0)} MiB`);
    expect(grown).toBeLessThan(100);
  }, 600_000);

  it(`sent 10,000+ requests and got no 5xx`, () => {
    console.log(`Fuzz: ${sent.total} requests sent; replies ${Object.entries(sent.byClass).sort().map(([k, n]) => `${k} ${n}`).join(', ')}`);
    expect(sent.byClass['5xx'] ?? 0).toBe(0);
    expect(sent.total).toBeGreaterThanOrEqual(10_000);
  });
});
