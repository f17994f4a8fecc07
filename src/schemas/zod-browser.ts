import { z } from 'zod';

/**
 * In a browser page or worker, zod parses without compiling code: its compiler first probes `new Function`,
 * which the pages' Content-Security-Policy (no 'unsafe-eval') refuses and reports as a violation on every
 * screen that parses a requirement set. The server keeps the compiled parsers. Imported first by the shared
 * requirement-set schema, so it is set before anything is parsed.
 */
const inBrowser = typeof (globalThis as { document?: unknown }).document !== 'undefined' || typeof (globalThis as { WorkerGlobalScope?: unknown }).WorkerGlobalScope !== 'undefined';
if (inBrowser) z.config({ jitless: true });
