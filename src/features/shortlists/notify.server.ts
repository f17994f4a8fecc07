import { and, eq, inArray, isNull, lte, gt } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { ballots, candidates, shortlists, shortlistVoters, specs, users } from '../../db/schema';
import { sendAll, type Mailer } from '../../lib/server/mail';
import { SCHEME_LABELS } from '../../engine';
import { votingOpenedMail, votingReminderMail, type VotingMailFacts } from './mail';

async function facts(db: Db, shortlistId: string, origin: string): Promise<VotingMailFacts | undefined> {
  const [row] = await db
    .select({ id: shortlists.id, title: shortlists.title, deadline: shortlists.deadline, specName: specs.name, ownerName: users.displayName })
    .from(shortlists)
    .innerJoin(specs, eq(specs.id, shortlists.specId))
    .innerJoin(users, eq(users.id, shortlists.ownerId))
    .where(eq(shortlists.id, shortlistId));
  if (!row?.deadline) return undefined;
  const live = await db.select({ scheme: candidates.scheme }).from(candidates).where(and(eq(candidates.shortlistId, shortlistId), isNull(candidates.removedAt)));
  return {
    shortlistId, title: row.title, specName: row.specName, ownerName: row.ownerName, deadline: row.deadline,
    candidates: live.map((c) => SCHEME_LABELS[c.scheme] ?? c.scheme),
    link: `${origin}/shortlists/${encodeURIComponent(shortlistId)}`,
  };
}

/** Mails each of `voterIds` that voting is open (or was extended for them). */
export async function notifyVotingOpened(db: Db, mailer: Mailer, shortlistId: string, voterIds: string[], origin: string): Promise<number> {
  const info = await facts(db, shortlistId, origin);
  if (!info || voterIds.length === 0) return 0;
  const recipients = await db.select({ email: users.email }).from(users).where(inArray(users.id, voterIds));
  await sendAll(mailer, recipients.map((r) => votingOpenedMail(r.email, info)));
  return recipients.length;
}

/**
 * The day-before reminder: for each shortlist in voting whose deadline falls within the next
 * 24 h and that has had no reminder yet, mail the invited voters who have not voted.
 */
export async function sendDueReminders(db: Db, mailer: Mailer, origin: string, now = new Date()): Promise<number> {
  const due = await db
    .select({ id: shortlists.id })
    .from(shortlists)
    .where(and(eq(shortlists.status, 'voting'), isNull(shortlists.reminderSentAt), gt(shortlists.deadline, now), lte(shortlists.deadline, new Date(now.getTime() + 24 * 3600_000))));
  let sent = 0;
  for (const { id } of due) {
    const claimed = await db.update(shortlists).set({ reminderSentAt: now }).where(and(eq(shortlists.id, id), isNull(shortlists.reminderSentAt))).returning({ id: shortlists.id });
    if (claimed.length === 0) continue; // another tick took it
    const info = await facts(db, id, origin);
    if (!info) continue;
    const pending = await db
      .select({ email: users.email, voterId: shortlistVoters.userId })
      .from(shortlistVoters)
      .innerJoin(users, eq(users.id, shortlistVoters.userId))
      .where(eq(shortlistVoters.shortlistId, id));
    const voted = new Set((await db.select({ voterId: ballots.voterId }).from(ballots).where(eq(ballots.shortlistId, id))).map((b) => b.voterId));
    const unvoted = pending.filter((p) => !voted.has(p.voterId));
    await sendAll(mailer, unvoted.map((p) => votingReminderMail(p.email, info)));
    sent += unvoted.length;
  }
  return sent;
}
