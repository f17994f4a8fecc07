import { openDatabase, type Db } from '../../db/client';
import { seedDemo } from '../../db/seed';
import { config } from './config';
import { createAuth, type Auth } from './auth';
import { hashPassword } from './password';
import { createSignInThrottle, type SignInThrottle } from './throttle';
import { createMailer, type Mailer } from './mail';
import { sendDueReminders } from '../../features/shortlists/notify.server';

export interface AppContext {
  db: Db;
  auth: Auth;
  throttle: SignInThrottle;
  mailer: Mailer;
  demo: boolean;
}

let app: Promise<AppContext> | undefined;

/**
 * The process-wide app context: one database (migrated, and seeded in demo mode), one lucia
 * instance, one throttle. The promise is cached so concurrent first requests share it.
 */
export function getApp(): Promise<AppContext> {
  app ??= (async () => {
    const { db } = await openDatabase({ databaseUrl: config.databaseUrl, dataDir: config.dataDir });
    if (config.demo) await seedDemo(db, hashPassword);
    const mailer = await createMailer(db, config.mail);
    // Day-before ballot reminders; checked every five minutes, never keeps the process alive.
    const reminders = setInterval(() => {
      sendDueReminders(db, mailer, config.linkOrigin).catch((error: unknown) => console.error('[resetwise] reminder check failed:', error));
    }, 5 * 60_000);
    reminders.unref();
    return { db, auth: createAuth(db, { secureCookie: config.secureCookie }), throttle: createSignInThrottle(), mailer, demo: config.demo };
  })().catch((error: unknown) => {
    app = undefined; // let the next request retry instead of caching the failure
    throw error;
  });
  return app;
}
