import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { openDatabase, type Database } from '../../src/db/client';
import { seedDemo } from '../../src/db/seed';
import { createMailer, type Mailer } from '../../src/lib/server/mail';
import { addCandidate, castBallot, createShortlist, openVoting } from '../../src/db/queries/shortlists';
import { sendDueReminders } from '../../src/features/shortlists/notify.server';
import { outbox, shortlists } from '../../src/db/schema';
import { frozenSnapshot } from '../helpers/snapshots';

let database: Database;
let mailer: Mailer;
beforeAll(async () => {
  database = await openDatabase({ dataDir: 'memory://' });
  await seedDemo(database.db, async (p) => `plain:${p}`);
  mailer = await createMailer(database.db, { from: 'Resetwise <noreply@resetwise.example>', capture: true });
});
afterAll(async () => {
  await mailer?.close();
  await database?.close();
});

const snapshot = frozenSnapshot('two-switch');
const architect = { id: 'demo-architect', role: 'architect' };

describe('day-before ballot reminders', () => {
  it('mail the invited voters who have not voted, once, when the deadline is within a day', async () => {
    const db = database.db;
    const id = await createShortlist(db, { specId: 'demo-spec-2', title: 'Server stage reset' }, architect.id);
    const a = await addCandidate(db, id, { scheme: 'two-switch', overrides: {}, note: '' }, snapshot, architect.id);
    const b = await addCandidate(db, id, { scheme: 'active-clamp', overrides: {}, note: '' }, snapshot, architect.id);
    const deadline = new Date(Date.now() + 30 * 3600_000);
    await openVoting(db, id, { deadline, voterIds: ['demo-engineer', 'demo-engineer2', 'demo-engineer3'] }, architect);
    await castBallot(db, id, 'demo-engineer', { ranking: [a, b], concerns: [], comment: '' });

    expect(await sendDueReminders(db, mailer, 'http://localhost:4321', new Date())).toBe(0); // 30 h away: not yet
    const dayBefore = new Date(deadline.getTime() - 20 * 3600_000);
    expect(await sendDueReminders(db, mailer, 'http://localhost:4321', dayBefore)).toBe(2);
    expect(await sendDueReminders(db, mailer, 'http://localhost:4321', new Date(dayBefore.getTime() + 600_000))).toBe(0);

    const reminders = await db.select().from(outbox).where(eq(outbox.kind, 'voting-reminder'));
    expect(reminders.map((m) => m.toAddresses).sort()).toEqual(['engineer2@resetwise.example', 'engineer3@resetwise.example']);
    expect(reminders[0]!.textBody).toContain(`http://localhost:4321/shortlists/${id}`);
    expect(reminders[0]!.status).toBe('captured');
    const [row] = await db.select().from(shortlists).where(eq(shortlists.id, id));
    expect(row!.reminderSentAt).not.toBeNull();
  });
});
