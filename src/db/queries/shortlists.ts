import { and, asc, desc, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { Db } from '../client';
import { newId } from '../ids';
import { auditLog, ballots, candidateSnapshots, candidates, shortlists, shortlistVoters, specs, users, type Candidate, type CandidateSnapshot, type Shortlist } from '../schema';
import { recordAudit } from './audit';
import { ShortlistRuleError } from './shortlist-rules';

export { ShortlistRuleError } from './shortlist-rules';
export { castBallot } from './ballots';

export interface SnapshotWrite {
  result: CandidateSnapshot['result'];
  input: CandidateSnapshot['input'];
  engineVersion: string;
  specVersion: number;
  partsLibraryVersion: string | null;
}

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

async function lockShortlist(tx: Tx, id: string): Promise<Shortlist> {
  const [row] = await tx.select().from(shortlists).where(eq(shortlists.id, id)).limit(1).for('update');
  if (!row) throw new ShortlistRuleError(404, 'No shortlist with this id.');
  return row;
}

function requireStatus(row: Shortlist, allowed: Shortlist['status'][], doing: string): void {
  if (!allowed.includes(row.status)) throw new ShortlistRuleError(409, `Cannot ${doing}: the shortlist is ${row.status}.`);
}

function requireOwner(row: Shortlist, actor: { id: string; role: string }, doing: string): void {
  if (row.ownerId !== actor.id && actor.role !== 'admin') throw new ShortlistRuleError(403, `Only the shortlist's owner may ${doing}.`);
}

export async function createShortlist(db: Db, input: { specId: string; title: string }, actorId: string): Promise<string> {
  const id = newId();
  await db.transaction(async (tx) => {
    const [spec] = await tx.select({ id: specs.id, archivedAt: specs.archivedAt }).from(specs).where(eq(specs.id, input.specId)).limit(1);
    if (!spec || spec.archivedAt) throw new ShortlistRuleError(404, 'No active requirement set with this specId.');
    await tx.insert(shortlists).values({ id, specId: input.specId, title: input.title, ownerId: actorId });
    await recordAudit(tx, { actorId, action: 'shortlist.created', entityType: 'shortlist', entityId: id, details: { title: input.title, specId: input.specId } });
  });
  return id;
}

export interface ShortlistSummary {
  id: string;
  title: string;
  status: Shortlist['status'];
  specId: string;
  specName: string;
  ownerName: string;
  deadline: Date | null;
  candidateCount: number;
  ballotCount: number;
  updatedAt: Date;
}

export async function listShortlists(db: Db, options: { specId?: string | undefined; decidedOnly?: boolean }): Promise<ShortlistSummary[]> {
  const conditions = [
    options.specId ? eq(shortlists.specId, options.specId) : undefined,
    options.decidedOnly ? eq(shortlists.status, 'decided') : undefined,
  ].filter((c) => c !== undefined);
  return db
    .select({
      id: shortlists.id,
      title: shortlists.title,
      status: shortlists.status,
      specId: shortlists.specId,
      specName: specs.name,
      ownerName: users.displayName,
      deadline: shortlists.deadline,
      candidateCount: sql<number>`(select count(*)::int from candidates c where c.shortlist_id = ${shortlists.id} and c.removed_at is null)`,
      ballotCount: sql<number>`(select count(*)::int from ballots b where b.shortlist_id = ${shortlists.id})`,
      updatedAt: shortlists.updatedAt,
    })
    .from(shortlists)
    .innerJoin(specs, eq(specs.id, shortlists.specId))
    .innerJoin(users, eq(users.id, shortlists.ownerId))
    .where(conditions.length > 0 ? and(...conditions) : undefined)
    .orderBy(desc(shortlists.updatedAt))
    .limit(500);
}

export async function getShortlist(db: Db, id: string): Promise<Shortlist | undefined> {
  const [row] = await db.select().from(shortlists).where(eq(shortlists.id, id)).limit(1);
  return row;
}

/** Adds a candidate with its first snapshot (draft only). */
export async function addCandidate(
  db: Db,
  shortlistId: string,
  input: { scheme: Candidate['scheme']; overrides: Candidate['overrides']; note: string },
  snapshot: SnapshotWrite,
  actorId: string,
): Promise<string> {
  const id = newId();
  await db.transaction(async (tx) => {
    const row = await lockShortlist(tx, shortlistId);
    requireStatus(row, ['draft'], 'add candidates');
    await tx.insert(candidates).values({ id, shortlistId, scheme: input.scheme, overrides: input.overrides, note: input.note, createdById: actorId });
    await tx.insert(candidateSnapshots).values({ id: newId(), candidateId: id, ...snapshot, createdById: actorId });
    await tx.update(shortlists).set({ updatedAt: new Date() }).where(eq(shortlists.id, shortlistId));
    await recordAudit(tx, { actorId, action: 'candidate.added', entityType: 'shortlist', entityId: shortlistId, details: { candidateId: id, scheme: input.scheme, note: input.note } });
  });
  return id;
}

export async function removeCandidate(db: Db, shortlistId: string, candidateId: string, actor: { id: string; role: string }): Promise<void> {
  await db.transaction(async (tx) => {
    const row = await lockShortlist(tx, shortlistId);
    requireOwner(row, actor, 'remove candidates');
    requireStatus(row, ['draft'], 'remove candidates');
    const removed = await tx
      .update(candidates)
      .set({ removedAt: new Date() })
      .where(and(eq(candidates.id, candidateId), eq(candidates.shortlistId, shortlistId), isNull(candidates.removedAt)))
      .returning({ scheme: candidates.scheme });
    if (removed.length === 0) throw new ShortlistRuleError(404, 'No such candidate on this shortlist.');
    await recordAudit(tx, { actorId: actor.id, action: 'candidate.removed', entityType: 'shortlist', entityId: shortlistId, details: { candidateId, scheme: removed[0]!.scheme } });
  });
}

/** Adds a fresh snapshot to a candidate; earlier ones are kept (draft only). */
export async function addSnapshot(db: Db, shortlistId: string, candidateId: string, snapshot: SnapshotWrite, actor: { id: string; role: string }): Promise<void> {
  await db.transaction(async (tx) => {
    const row = await lockShortlist(tx, shortlistId);
    requireOwner(row, actor, 're-evaluate candidates');
    requireStatus(row, ['draft'], 're-evaluate candidates');
    const [candidate] = await tx.select().from(candidates).where(and(eq(candidates.id, candidateId), eq(candidates.shortlistId, shortlistId), isNull(candidates.removedAt)));
    if (!candidate) throw new ShortlistRuleError(404, 'No such candidate on this shortlist.');
    await tx.insert(candidateSnapshots).values({ id: newId(), candidateId, ...snapshot, createdById: actor.id });
    await recordAudit(tx, { actorId: actor.id, action: 'candidate.reevaluated', entityType: 'shortlist', entityId: shortlistId, details: { candidateId, engineVersion: snapshot.engineVersion, specVersion: snapshot.specVersion } });
  });
}

/** Opens voting (draft → voting) or, while voting, extends the deadline and invites more voters. */
export async function openVoting(db: Db, shortlistId: string, input: { deadline: Date; voterIds: string[] }, actor: { id: string; role: string }): Promise<void> {
  await db.transaction(async (tx) => {
    const row = await lockShortlist(tx, shortlistId);
    requireOwner(row, actor, 'open or extend voting');
    requireStatus(row, ['draft', 'voting'], 'open voting');
    if (input.deadline.getTime() <= Date.now()) throw new ShortlistRuleError(400, 'The deadline must be in the future.');
    if (row.status === 'voting' && row.deadline && input.deadline < row.deadline) throw new ShortlistRuleError(400, 'An extension must move the deadline later, not earlier.');
    const live = await tx.select({ id: candidates.id }).from(candidates).where(and(eq(candidates.shortlistId, shortlistId), isNull(candidates.removedAt)));
    if (live.length < 2) throw new ShortlistRuleError(409, 'A ballot needs at least two candidates.');
    const voters = input.voterIds.length === 0 ? [] : await tx.select({ id: users.id, role: users.role, active: users.active }).from(users).where(inArray(users.id, input.voterIds));
    const bad = input.voterIds.filter((id) => !voters.some((v) => v.id === id && v.active && (v.role === 'engineer' || v.role === 'architect')));
    if (bad.length > 0) throw new ShortlistRuleError(400, `Voters must be active engineers or architects; not eligible: ${bad.slice(0, 5).join(', ')}${bad.length > 5 ? '…' : ''}.`);
    await tx.insert(shortlistVoters).values(input.voterIds.map((userId) => ({ shortlistId, userId }))).onConflictDoNothing();
    const now = new Date();
    await tx
      .update(shortlists)
      .set({ status: 'voting', deadline: input.deadline, openedAt: row.openedAt ?? now, updatedAt: now, ...(row.deadline && input.deadline > row.deadline ? { reminderSentAt: null } : {}) })
      .where(eq(shortlists.id, shortlistId));
    await recordAudit(tx, {
      actorId: actor.id,
      action: row.status === 'draft' ? 'voting.opened' : 'voting.extended',
      entityType: 'shortlist',
      entityId: shortlistId,
      details: { deadline: input.deadline.toISOString(), voters: input.voterIds.length },
    });
  });
}

export async function closeVoting(db: Db, shortlistId: string, actor: { id: string; role: string }): Promise<void> {
  await db.transaction(async (tx) => {
    const row = await lockShortlist(tx, shortlistId);
    requireOwner(row, actor, 'close voting');
    requireStatus(row, ['voting'], 'close voting');
    const now = new Date();
    await tx.update(shortlists).set({ status: 'closed', closedAt: now, updatedAt: now }).where(eq(shortlists.id, shortlistId));
    await recordAudit(tx, { actorId: actor.id, action: 'voting.closed', entityType: 'shortlist', entityId: shortlistId });
  });
}

export async function recordDecision(db: Db, shortlistId: string, input: { candidateId: string; rationale: string }, actor: { id: string; role: string }): Promise<void> {
  await db.transaction(async (tx) => {
    const row = await lockShortlist(tx, shortlistId);
    requireOwner(row, actor, 'record the decision');
    requireStatus(row, ['closed'], 'record a decision (close voting first)');
    const [candidate] = await tx.select({ id: candidates.id, scheme: candidates.scheme }).from(candidates).where(and(eq(candidates.id, input.candidateId), eq(candidates.shortlistId, shortlistId), isNull(candidates.removedAt)));
    if (!candidate) throw new ShortlistRuleError(400, 'candidateId must be one of this shortlist\'s candidates.');
    const now = new Date();
    await tx
      .update(shortlists)
      .set({ status: 'decided', decidedCandidateId: candidate.id, rationale: input.rationale, decidedById: actor.id, decidedAt: now, updatedAt: now })
      .where(eq(shortlists.id, shortlistId));
    await recordAudit(tx, { actorId: actor.id, action: 'shortlist.decided', entityType: 'shortlist', entityId: shortlistId, details: { candidateId: candidate.id, scheme: candidate.scheme, rationale: input.rationale } });
  });
}

export async function withdrawShortlist(db: Db, shortlistId: string, actor: { id: string; role: string }): Promise<void> {
  await db.transaction(async (tx) => {
    const row = await lockShortlist(tx, shortlistId);
    requireOwner(row, actor, 'withdraw it');
    requireStatus(row, ['draft', 'voting', 'closed'], 'withdraw it');
    await tx.update(shortlists).set({ status: 'withdrawn', updatedAt: new Date() }).where(eq(shortlists.id, shortlistId));
    await recordAudit(tx, { actorId: actor.id, action: 'shortlist.withdrawn', entityType: 'shortlist', entityId: shortlistId });
  });
}

/** Everything the shortlist page and GET /shortlists/:id need, in one read. */
export async function loadShortlistParts(db: Db, shortlistId: string) {
  const [live, snapshots, voters, ballotRows, history] = await Promise.all([
    db.select().from(candidates).where(and(eq(candidates.shortlistId, shortlistId), isNull(candidates.removedAt))).orderBy(asc(candidates.createdAt)),
    db
      .select()
      .from(candidateSnapshots)
      .innerJoin(candidates, eq(candidates.id, candidateSnapshots.candidateId))
      .where(eq(candidates.shortlistId, shortlistId))
      .orderBy(asc(candidateSnapshots.createdAt)),
    db.select({ id: users.id, name: users.displayName, role: users.role }).from(shortlistVoters).innerJoin(users, eq(users.id, shortlistVoters.userId)).where(eq(shortlistVoters.shortlistId, shortlistId)).orderBy(asc(users.displayName)),
    db.select({ ballot: ballots, voterName: users.displayName }).from(ballots).innerJoin(users, eq(users.id, ballots.voterId)).where(eq(ballots.shortlistId, shortlistId)),
    db
      .select({ action: auditLog.action, details: auditLog.details, at: auditLog.at, actorName: users.displayName })
      .from(auditLog)
      .leftJoin(users, eq(users.id, auditLog.actorId))
      .where(and(eq(auditLog.entityType, 'shortlist'), eq(auditLog.entityId, shortlistId)))
      .orderBy(asc(auditLog.at), asc(auditLog.id)),
  ]);
  return { live, snapshots: snapshots.map((s) => s.candidate_snapshots), voters, ballots: ballotRows, history };
}
