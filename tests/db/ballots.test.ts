import { describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import { frozenSnapshot } from '../helpers/snapshots';
import { backends, seededDemoDatabase } from '../helpers/databases';
import { addCandidate, castBallot, closeVoting, createShortlist, openVoting, ShortlistRuleError } from '../../src/db/queries/shortlists';
import { auditLog, ballots } from '../../src/db/schema';

// Group commit of ballots (issue #8): ballots cast at the same moment share transactions, yet each
// one gets exactly the answer it would get alone. Rules from the ballot workflow, checked per ballot.

const snapshot = frozenSnapshot('two-switch');
const architect = { id: 'demo-architect', role: 'architect' };

/** The rejection of a ballot as `status message`, or 'ok' / 'changed'. */
async function outcomeOf(promise: Promise<{ changed: boolean }>): Promise<string> {
  try {
    return (await promise).changed ? 'changed' : 'ok';
  } catch (error) {
    if (error instanceof ShortlistRuleError) return `${error.status} ${error.message}`;
    throw error;
  }
}

describe.each(backends())('ballots written together on $name', (backend) => {
  const database = seededDemoDatabase(backend);

  async function votingShortlist(voterIds: string[]): Promise<{ id: string; a: string; b: string }> {
    const db = database().db;
    const id = await createShortlist(db, { specId: 'demo-spec-1', title: `Batch ${Math.random()}` }, architect.id);
    const a = await addCandidate(db, id, { scheme: 'two-switch', overrides: {}, note: '' }, snapshot, architect.id);
    const b = await addCandidate(db, id, { scheme: 'active-clamp', overrides: {}, note: '' }, snapshot, architect.id);
    await openVoting(db, id, { deadline: new Date(Date.now() + 86_400_000), voterIds }, architect);
    return { id, a, b };
  }

  it('simultaneous ballots: each gets its own answer; refused ones write nothing; one ballot per voter', async () => {
    const db = database().db;
    const { id, a, b } = await votingShortlist(['demo-engineer', 'demo-engineer2', 'demo-architect']);
    const good = { ranking: [a, b], concerns: [], comment: '' };
    const results = await Promise.all([
      outcomeOf(castBallot(db, id, 'demo-engineer', good)),
      outcomeOf(castBallot(db, id, 'demo-engineer2', { ...good, ranking: [a] })),
      outcomeOf(castBallot(db, id, 'demo-engineer3', good)),
      outcomeOf(castBallot(db, id, 'demo-architect', { ...good, concerns: [{ candidateId: 'elsewhere', reason: 'not on this list' }] })),
      outcomeOf(castBallot(db, id, 'demo-engineer', { ...good, ranking: [b, a] })), // same voter again: changes the first
      outcomeOf(castBallot(db, id, 'demo-engineer2', { ...good, ranking: [b, a], concerns: [{ candidateId: a, reason: 'reset winding insulation at 150 V' }] })),
    ]);
    expect(results).toEqual([
      'ok',
      '400 The ranking must name each of the 2 candidates exactly once.',
      '403 You are not invited to vote on this shortlist.',
      '400 A concern names a candidate that is not on this shortlist.',
      'changed',
      'ok',
    ]);
    const stored = await db.select().from(ballots).where(eq(ballots.shortlistId, id));
    expect(stored.map((s) => [s.voterId, s.ranking]).sort()).toEqual([['demo-engineer', [b, a]], ['demo-engineer2', [b, a]]]);
    expect(stored.find((s) => s.voterId === 'demo-engineer2')!.concerns).toEqual([{ candidateId: a, reason: 'reset winding insulation at 150 V' }]);
    const audits = await db.select().from(auditLog).where(and(eq(auditLog.entityType, 'shortlist'), eq(auditLog.entityId, id)));
    expect(audits.filter((e) => e.action.startsWith('ballot.')).map((e) => `${e.actorId} ${e.action}`).sort()).toEqual([
      'demo-engineer ballot.cast', 'demo-engineer ballot.changed', 'demo-engineer2 ballot.cast',
    ]);
  });

  it('many voters at once are all counted once', async () => {
    const db = database().db;
    const voters = ['demo-engineer', 'demo-engineer2', 'demo-engineer3', 'demo-architect'];
    const { id, a, b } = await votingShortlist(voters);
    const replies = await Promise.all([...voters, ...voters, ...voters].map((v, i) => outcomeOf(castBallot(db, id, v, { ranking: i % 2 ? [a, b] : [b, a], concerns: [], comment: `round ${i}` }))));
    expect(replies.filter((r) => r === 'ok')).toHaveLength(4);
    expect(replies.filter((r) => r === 'changed')).toHaveLength(8);
    const stored = await db.select().from(ballots).where(eq(ballots.shortlistId, id));
    expect(stored).toHaveLength(4);
    // Within one voter, ballots are applied in the order they were cast: the last one stands.
    expect(stored.map((s) => s.comment).sort()).toEqual(['round 10', 'round 11', 'round 8', 'round 9']);
  });

  it('after voting closes, every ballot waiting is refused with the same reason; unknown shortlists are 404', async () => {
    const db = database().db;
    const { id, a, b } = await votingShortlist(['demo-engineer', 'demo-engineer2']);
    await closeVoting(db, id, architect);
    const replies = await Promise.all(['demo-engineer', 'demo-engineer2'].map((v) => outcomeOf(castBallot(db, id, v, { ranking: [a, b], concerns: [], comment: '' }))));
    expect(replies).toEqual(['409 Voting is not open: the shortlist is closed.', '409 Voting is not open: the shortlist is closed.']);
    expect(await outcomeOf(castBallot(db, 'no-such-list', 'demo-engineer', { ranking: [a, b], concerns: [], comment: '' }))).toBe('404 No shortlist with this id.');
    expect(await db.select().from(ballots).where(eq(ballots.shortlistId, id))).toHaveLength(0);
  });
});
