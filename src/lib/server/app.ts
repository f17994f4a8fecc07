import { openDatabase, type Db } from '../../db/client';
import { seedDemo } from '../../db/seed';
import { config } from './config';
import { createAuth, SESSION_LIFETIME, type Auth } from './auth';
import { SessionCache } from './session-cache';
import { hashPassword } from './password';
import { createMailer, type Mailer } from './mail';
import { sendDueReminders } from '../../features/shortlists/notify.server';

export interface AppContext {
  db: Db;
  auth: Auth;
  /** Validated sessions of this process; members' changes must evict through it (see users PATCH). */
  sessions: SessionCache;
  mailer: Mailer;
  demo: boolean;
}

let app: Promise<AppContext> | undefined;
let closers: (() => unknown)[] = [];
let closing = false;

/** With a shared PostgreSQL server: how long a cached session is trusted before the database is asked again. */
export const SESSION_RECHECK_MS = 2_000;

/**
 * The process-wide app context: one database (migrated, and seeded in demo mode), one lucia
 * instance, one mailer. The promise is cached so concurrent first requests share it.
 */
export function getApp(): Promise<AppContext> {
  if (closing) return Promise.reject(new Error('the server is shutting down'));
  app ??= (async () => {
    // The demo seed runs with the migrations, under PostgreSQL's advisory lock: any number of processes may start together.
    const database = await openDatabase({
      databaseUrl: config.databaseUrl,
      dataDir: config.dataDir,
      prepare: config.demo ? (db) => seedDemo(db, hashPassword) : undefined,
    });
    const { db, kind } = database;
    const mailer = await createMailer(db, config.mail);
    // Day-before ballot reminders; checked every five minutes, never keeps the process alive.
    const reminders = setInterval(() => {
      sendDueReminders(db, mailer, config.linkOrigin).catch((error: unknown) => console.error('[resetwise] reminder check failed:', error));
    }, 5 * 60_000);
    reminders.unref();
    // The embedded database has one writer, this process, so every change evicts exactly; a
    // PostgreSQL server may be shared by several processes, so there a hit is re-checked after 2 s.
    const sessions = new SessionCache({ lifetimeMs: SESSION_LIFETIME.milliseconds(), maxAgeMs: kind === 'pglite' ? null : SESSION_RECHECK_MS, maxEntries: 10_000 });
    closers = [() => clearInterval(reminders), () => mailer.close(), () => database.close()];
    return { db, auth: createAuth(db, { secureCookie: config.secureCookie, sessionCache: sessions }), sessions, mailer, demo: config.demo };
  })().catch((error: unknown) => {
    app = undefined; // let the next request retry instead of caching the failure
    throw error;
  });
  return app;
}

/**
 * Closes what the app opened (the reminder timer, the mailer, the database: PGlite writes its folder, the
 * PostgreSQL pool ends) once the HTTP front has stopped accepting and its requests have finished. Safe to call
 * when the app was never opened, and more than once; the app does not open again afterwards.
 */
export async function closeApp(): Promise<void> {
  closing = true;
  const opened = app;
  if (!opened) return;
  await opened.catch(() => undefined);
  const pending = closers;
  closers = [];
  for (const close of pending) await close();
}

// The HTTP front (scripts/http/front.mjs) lives outside this bundle and finds the close step here at shutdown.
(globalThis as Record<symbol, unknown>)[Symbol.for('resetwise.closeApp')] = closeApp;
