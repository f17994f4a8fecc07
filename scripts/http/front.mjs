// The HTTP front of a Resetwise server: a plain Node server around the Astro app (its adapter runs in
// middleware mode, so the build starts no server of its own). What must hold for every request is decided
// here, once, before a route or a session is looked at:
// - the client's address (the peer, or the client a trusted proxy names), passed on as X-Forwarded-For;
// - the body size limit, enforced while the body streams in;
// - the security headers of every reply;
// - a graceful stop: on SIGTERM/SIGINT no new requests, in-flight ones finish (at most 10 s), the database closes.
import http from 'node:http';
import https from 'node:https';
import { bodyIterable, bodyLimit, METHODS_WITH_BODIES, readLimitedBody, tooLargeMessage } from './body.mjs';
import { resolveClient } from './client-address.mjs';
import { securityHeaders } from './security-headers.mjs';
import { createStaticFiles } from './static-files.mjs';

/** Forwarding headers: believed only from a trusted proxy. */
const FORWARDING = ['x-forwarded-for', 'x-forwarded-host', 'x-forwarded-proto', 'x-forwarded-port', 'forwarded', 'x-real-ip'];

/** How long a refused body may keep arriving after its 413 before the connection is closed. */
const LINGER_MS = 2_000;

/**
 * Closes a connection whose client may still be sending a refused body: the reply and our end of the
 * connection go out (FIN), what still arrives is read and dropped, and only then is the socket destroyed.
 * Node's own close after a `Connection: close` reply destroys at once, and data arriving at a destroyed
 * socket makes the kernel answer with a reset, which discards the reply before the client has read it.
 */
function lingeringClose(socket) {
  socket.destroySoon = () => {
    socket.end();
    socket.resume();
    setTimeout(() => socket.destroy(), LINGER_MS).unref();
  };
}

function first(value) {
  return [value ?? ''].flat()[0].split(',')[0].trim().toLowerCase();
}

function replyJson(res, status, body, headers = {}) {
  const bytes = Buffer.from(JSON.stringify(body));
  res.writeHead(status, { 'content-type': 'application/json; charset=utf-8', 'content-length': bytes.length, 'cache-control': 'no-store', ...headers });
  res.end(bytes);
}

/**
 * @param {object} options
 * @param {(req, res, next?, locals?) => Promise<void>} options.app the adapter's handler (dist/server/entry.mjs)
 * @param {string} options.clientDir dist/client
 * @param {ReturnType<import('./body.mjs').loadBodyLimits>} options.limits
 * @param {import('node:net').BlockList | null} options.trustedProxies
 * @param {() => Promise<void>} options.closeApp closes the app's database and mailer
 * @param {{ key: Buffer, cert: Buffer }} [options.tls]
 * @param {number} [options.drainMs] longest wait for in-flight requests at shutdown
 */
export function createFront({ app, clientDir, limits, trustedProxies, closeApp, tls, drainMs = 10_000 }) {
  const staticFiles = createStaticFiles(clientDir);
  let stopping = null;
  let inFlight = 0;
  let drained = () => undefined;

  async function handle(req, res) {
    const client = resolveClient(req.socket.remoteAddress, req.headers['x-forwarded-for'], trustedProxies);
    const secure = Boolean(req.socket.encrypted) || (client.viaProxy && first(req.headers['x-forwarded-proto']) === 'https');
    for (const [name, value] of Object.entries(securityHeaders({ https: secure }))) res.setHeader(name, value);
    if (!client.viaProxy) for (const name of FORWARDING) delete req.headers[name];
    // The adapter takes the client's address from the first X-Forwarded-For entry: give it the resolved one.
    req.headers['x-forwarded-for'] = client.address;
    if (stopping) return replyJson(res, 503, { error: 'This server is shutting down; try again in a moment.' }, { connection: 'close', 'retry-after': '2' });
    try {
      decodeURI(req.url ?? '/');
    } catch {
      return replyJson(res, 400, { error: 'The address is not valid.' });
    }
    if (METHODS_WITH_BODIES.has(req.method ?? '')) {
      const pathname = (req.url ?? '/').split('?')[0];
      const limit = bodyLimit(pathname, limits);
      const tooLarge = () => {
        lingeringClose(req.socket);
        replyJson(res, 413, { error: tooLargeMessage(pathname, limits) }, { connection: 'close' });
      };
      if (Number(req.headers['content-length'] ?? 0) > limit) return tooLarge();
      const body = await readLimitedBody(req, limit);
      if (!body.ok) return body.reason === 'too-large' ? tooLarge() : res.destroy();
      req.body = bodyIterable(body.body);
    }
    await new Promise((resolve, reject) => {
      staticFiles(req, res, () => app(req, res).then(resolve, reject));
      res.once('finish', resolve);
      res.once('close', resolve);
    });
  }

  const listener = (req, res) => {
    inFlight++;
    res.once('close', () => {
      inFlight--;
      if (stopping) server.closeIdleConnections();
      if (inFlight === 0) drained();
    });
    handle(req, res).catch((error) => {
      console.error(`[resetwise] ${req.method} ${req.url} failed:`, error);
      if (!res.headersSent) replyJson(res, 500, { error: 'Something went wrong on the server. The error was logged.' });
      else res.destroy();
    });
  };
  const server = tls ? https.createServer(tls, listener) : http.createServer(listener);
  server.requestTimeout = 120_000;
  // What Node's parser refuses before a request exists (an address or headers over 16 KB, broken HTTP) still
  // gets a JSON reason and the security headers, not an empty reply.
  server.on('clientError', (error, socket) => {
    if (!socket.writable || error.code === 'ECONNRESET') return socket.destroy();
    const [status, reason, message] = error.code === 'HPE_HEADER_OVERFLOW'
      ? [431, 'Request Header Fields Too Large', 'The address or the headers of the request are longer than 16 KB.']
      : error.code === 'ERR_HTTP_REQUEST_TIMEOUT' ? [408, 'Request Timeout', 'The request took too long to arrive.'] : [400, 'Bad Request', 'The request is not valid HTTP.'];
    const body = JSON.stringify({ error: message });
    const headers = { ...securityHeaders({ https: Boolean(socket.encrypted) }), 'content-type': 'application/json; charset=utf-8', 'content-length': Buffer.byteLength(body), connection: 'close' };
    socket.end(`HTTP/1.1 ${status} ${reason}\r\n${Object.entries(headers).map(([k, v]) => `${k}: ${v}`).join('\r\n')}\r\n\r\n${body}`);
  });

  /** Stops accepting, lets in-flight requests finish (at most drainMs), closes the app. Resolves once all is closed. */
  function stop() {
    stopping ??= (async () => {
      server.close();
      server.closeIdleConnections();
      if (inFlight > 0) {
        await new Promise((resolve) => {
          drained = resolve;
          setTimeout(resolve, drainMs).unref();
        });
      }
      server.closeAllConnections();
      await closeApp();
    })();
    return stopping;
  }

  return { server, stop };
}
