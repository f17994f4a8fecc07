import type { AddressInfo } from 'node:net';
import { afterEach, describe, expect, it } from 'vitest';
import { parseTrustedProxies, resolveClient } from '../../scripts/http/client-address.mjs';
import { bodyLimit, loadBodyLimits, tooLargeMessage } from '../../scripts/http/body.mjs';
import { createFront } from '../../scripts/http/front.mjs';
import { securityHeaders } from '../../scripts/http/security-headers.mjs';
import { rawRequest } from '../helpers/raw-http';

// Issue 16: the HTTP front's parts, and the front itself around a stand-in app.

describe('client address', () => {
  const proxies = parseTrustedProxies('127.0.0.1, 10.0.0.0/8 ::1');

  it.each([
    ['a direct client; its own header is ignored', '198.51.100.7', '203.0.113.1', '198.51.100.7', false],
    ['through the proxy: the address it appended', '127.0.0.1', '203.0.113.1', '203.0.113.1', true],
    ['through two trusted proxies: the first untrusted from the right', '127.0.0.1', '192.0.2.9, 203.0.113.1, 10.1.2.3', '203.0.113.1', true],
    ['a client-chosen prefix does not count', '127.0.0.1', 'evil, 1.2.3.4, 203.0.113.1', '203.0.113.1', true],
    ['a garbled hop stops the walk at the last trusted one', '127.0.0.1', '203.0.113.1, not-an-address', '127.0.0.1', true],
    ['the proxy with no header: the proxy itself', '127.0.0.1', undefined, '127.0.0.1', true],
    ['an IPv4-mapped peer', '::ffff:127.0.0.1', '203.0.113.5', '203.0.113.5', true],
    ['an IPv6 proxy', '::1', '2001:db8::5', '2001:db8::5', true],
  ])('%s', (_what, peer, forwarded, client, viaProxy) => {
    expect(resolveClient(peer, forwarded, proxies)).toEqual({ address: client, viaProxy });
  });

  it('with no TRUSTED_PROXIES nobody is trusted', () => {
    expect(parseTrustedProxies(undefined)).toBeNull();
    expect(parseTrustedProxies(' ')).toBeNull();
    expect(resolveClient('127.0.0.1', '203.0.113.1', null)).toEqual({ address: '127.0.0.1', viaProxy: false });
  });

  it.each(['proxy.example', '10.0.0.0/33', '10.0.0.0/x', '::1/129'])('"%s" stops the start with a plain message', (entry) => {
    expect(() => parseTrustedProxies(entry)).toThrow(/TRUSTED_PROXIES: ".+"/);
  });
});

describe('body limits', () => {
  const limits = loadBodyLimits();
  it('uploads take a 2 MB file and its framing; every other route 1 MB of JSON', () => {
    expect(bodyLimit('/api/v1/parts/import', limits)).toBe(2 * 1024 * 1024 + 64 * 1024);
    expect(bodyLimit('/api/v1/specs/import/', limits)).toBe(2 * 1024 * 1024 + 64 * 1024);
    expect(bodyLimit('/api/v1/specs', limits)).toBe(1_000_000);
    expect(tooLargeMessage('/api/v1/specs/import', limits)).toBe('The upload is larger than this route accepts: files may be at most 2 MB.');
    expect(tooLargeMessage('/api/v1/evaluate', limits)).toBe('The body is larger than 1 MB, the most this route accepts.');
  });

  it('HSTS only over HTTPS', () => {
    expect(securityHeaders({ https: false })).not.toHaveProperty('strict-transport-security');
    expect(securityHeaders({ https: true })['strict-transport-security']).toMatch(/^max-age=31536000/);
  });
});

describe('the front around a stand-in app', () => {
  let stop: (() => Promise<void>) | undefined;
  afterEach(async () => {
    await stop?.();
    stop = undefined;
  });

  async function start(app: (req: import('node:http').IncomingMessage, res: import('node:http').ServerResponse) => Promise<void>, closeApp = async () => undefined) {
    const front = createFront({ app, clientDir: '/nonexistent', limits: loadBodyLimits(), trustedProxies: parseTrustedProxies('127.0.0.3'), closeApp, drainMs: 2_000 });
    await new Promise<void>((resolve) => front.server.listen(0, '127.0.0.1', resolve));
    stop = () => front.stop();
    return { url: `http://127.0.0.1:${(front.server.address() as AddressInfo).port}`, front };
  }

  it('hands the app the resolved client, no forged forwarding headers, and the body read whole', async () => {
    const seen: Record<string, unknown>[] = [];
    const { url } = await start(async (req, res) => {
      const chunks: Buffer[] = [];
      for await (const chunk of (req as unknown as { body: AsyncIterable<Buffer> }).body) chunks.push(chunk);
      seen.push({ xff: req.headers['x-forwarded-for'], host: req.headers['x-forwarded-host'], proto: req.headers['x-forwarded-proto'], body: Buffer.concat(chunks).toString() });
      res.end('ok');
    });
    const forged = { 'x-forwarded-for': '203.0.113.1', 'x-forwarded-host': 'evil.example', 'x-forwarded-proto': 'https', 'content-type': 'application/json' };
    const direct = await rawRequest(url, '/api/v1/x', { method: 'POST', localAddress: '127.0.0.2', headers: forged, body: '{"a":1}' });
    const proxied = await rawRequest(url, '/api/v1/x', { method: 'POST', localAddress: '127.0.0.3', headers: forged, body: '{"b":2}' });
    expect(seen).toEqual([
      { xff: '127.0.0.2', host: undefined, proto: undefined, body: '{"a":1}' },
      { xff: '203.0.113.1', host: 'evil.example', proto: 'https', body: '{"b":2}' },
    ]);
    expect(direct.headers['strict-transport-security']).toBeUndefined();
    expect(proxied.headers['strict-transport-security']).toBeDefined();
    expect(direct.headers['x-content-type-options']).toBe('nosniff');
  });

  it('a stop lets the request in flight finish, refuses new connections, then closes the app', async () => {
    const events: string[] = [];
    let release = (): void => undefined;
    const { url, front } = await start(
      async (_req, res) => {
        events.push('request');
        await new Promise<void>((resolve) => (release = resolve));
        res.end('done');
        events.push('answered');
      },
      async () => {
        events.push('app closed');
      },
    );
    const inFlight = rawRequest(url, '/slow');
    await expect.poll(() => events.length).toBe(1);
    const stopped = front.stop();
    await expect(rawRequest(url, '/late')).rejects.toThrow(/ECONNREFUSED/);
    release();
    expect((await inFlight).text).toBe('done');
    await stopped;
    expect(events).toEqual(['request', 'answered', 'app closed']);
    stop = undefined;
  });
});
