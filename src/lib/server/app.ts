import { openDatabase, type Db } from '../../db/client';
import { seedDemo } from '../../db/seed';
import { config } from './config';
import { createAuth, SESSION_LIFETIME, type Auth } from './auth';
import { SessionCache } from './session-cache';
import { hashPassword } from './password';
import { createSignInThrottle, type SignInThrottle } from './throttle';
import { createMailer, type Mailer } from './mail';
import { sendDueReminders } from '../../features/shortlists/notify.server';

export interface AppContext {
  db: Db;
  auth: Auth;
  /** Validated sessions of this process; members' changes must evict through it (see users PATCH). */
  sessions: SessionCache;
  throttle: SignInThrottle;
  mailer: Mailer;
  demo: boolean;
}

let app: Promise<AppContext> | undefined;

/** With a shared PostgreSQL server: how long a cached session is trusted before the database is asked again. */
export const SESSION_RECHECK_MS = 2_000;

/**
 * The process-wide app context: one database (migrated, and seeded in demo mode), one lucia
 * instance, one throttle. The promise is cached so concurrent first requests share it.
 */
export function getApp(): Promise<AppContext> {
  app ??= (async () => {
    const { db, kind } = await openDatabase({ databaseUrl: config.databaseUrl, dataDir: config.dataDir });
    if (config.demo) await seedDemo(db, hashPassword);
    const mailer = await createMailer(db, config.mail);
    // Day-before ballot reminders; checked every five minutes, never keeps the process alive.
    const reminders = setInterval(() => {
      sendDueReminders(db, mailer, config.linkOrigin).catch((error: unknown) => console.error('[resetwise] reminder check failed:', error));
    }, 5 * 60_000);
    reminders.unref();
    // The embedded database has one writer, this process, so every change evicts exactly; a
    // PostgreSQL server may be shared by several processes, so there a hit is re-checked after 2 s.
    const sessions = new SessionCache({ lifetimeMs: SESSION_LIFETIME.milliseconds(), maxAgeMs: kind === 'pglite' ? null : SESSION_RECHECK_MS, maxEntries: 10_000 });
    return { db, auth: createAuth(db, { secureCookie: config.secureCookie, sessionCache: sessions }), sessions, throttle: createSignInThrottle(), mailer, demo: config.demo };
  })().catch((error: unknown) => {
    app = undefined; // let the next request retry instead of caching the failure
    throw error;
  });
  return app;
}
