#!/usr/bin/env node
// Serves a built Resetwise (dist/, or RESETWISE_DIST) through the HTTP front (scripts/http/front.mjs).
// `npm start` builds when needed and then runs this; a service manager runs it directly
// (deploy/resetwise@.service). Environment: HOST, PORT, TRUSTED_PROXIES, SERVER_CERT_PATH + SERVER_KEY_PATH
// (HTTPS without a proxy), and the app's own settings (README, "Configuration").
import { existsSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath, pathToFileURL } from 'node:url';
import { createFront } from './http/front.mjs';
import { loadBodyLimits } from './http/body.mjs';
import { parseTrustedProxies } from './http/client-address.mjs';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const dist = path.resolve(root, process.env.RESETWISE_DIST ?? 'dist');
const entry = path.join(dist, 'server', 'entry.mjs');
if (!existsSync(entry)) {
  console.error(`[resetwise] ${entry} is missing: build first (npm run build), or use npm start.`);
  process.exit(1);
}

/** Starts the server; resolves once it listens. */
export async function serve() {
  const host = process.env.HOST ?? '127.0.0.1';
  const port = Number(process.env.PORT ?? 4321);
  const trustedProxies = parseTrustedProxies(process.env.TRUSTED_PROXIES);
  const tls = process.env.SERVER_CERT_PATH && process.env.SERVER_KEY_PATH
    ? { cert: readFileSync(process.env.SERVER_CERT_PATH), key: readFileSync(process.env.SERVER_KEY_PATH) }
    : undefined;
  const { handler } = await import(pathToFileURL(entry).href);
  const closeApp = () => globalThis[Symbol.for('resetwise.closeApp')]?.() ?? Promise.resolve();
  const front = createFront({ app: handler, clientDir: path.join(dist, 'client'), limits: loadBodyLimits(), trustedProxies, closeApp, tls });
  for (const signal of ['SIGTERM', 'SIGINT']) {
    process.once(signal, () => {
      console.log(`[resetwise] ${signal}: finishing requests in flight, then closing the database`);
      front.stop().then(
        () => process.exit(0),
        (error) => {
          console.error('[resetwise] shutdown failed:', error);
          process.exit(1);
        },
      );
    });
  }
  await new Promise((resolve, reject) => {
    front.server.once('error', reject);
    front.server.listen(port, host, resolve);
  });
  console.log(`[resetwise] listening on ${tls ? 'https' : 'http'}://${host.includes(':') ? `[${host}]` : host}:${port}${trustedProxies ? ' (trusting the configured proxies)' : ''}`);
  return front;
}

if (process.argv[1] && path.resolve(process.argv[1]) === fileURLToPath(import.meta.url)) await serve();
