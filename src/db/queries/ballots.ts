import { sql } from 'drizzle-orm';
import type { Db } from '../client';
import { newId } from '../ids';
import { ballots } from '../schema';
import { recordAudits } from './audit';
import { ShortlistRuleError } from './shortlist-rules';
import type { BallotInput } from '../../schemas/shortlists';

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];
type Outcome = { changed: boolean } | ShortlistRuleError;

interface Pending {
  voterId: string;
  ballot: BallotInput;
  resolve(outcome: { changed: boolean }): void;
  reject(error: unknown): void;
}

/** Per database, per shortlist: ballots waiting for the next transaction while one is being written. */
const waiting = new WeakMap<Db, Map<string, Pending[]>>();

/**
 * Casts or changes a ballot. Ballots for one shortlist are written by group commit: the first
 * starts a transaction at once; those that arrive while it runs are checked and written together
 * in the next one, so 200 simultaneous voters cost a handful of transactions instead of 200. Every
 * rule is checked per ballot inside the transaction that writes it (voting open, deadline not
 * passed, voter invited, the ranking naming each live candidate exactly once, concerns about
 * candidates on the shortlist), and each caller's promise settles only after that commit. A voter
 * has at most one ballot per transaction (a second one waits and then changes the first), and the
 * unique index still keeps one ballot per voter.
 */
export function castBallot(db: Db, shortlistId: string, voterId: string, ballot: BallotInput): Promise<{ changed: boolean }> {
  return new Promise((resolve, reject) => {
    let perShortlist = waiting.get(db);
    if (!perShortlist) waiting.set(db, (perShortlist = new Map()));
    const queue = perShortlist.get(shortlistId);
    if (queue) {
      queue.push({ voterId, ballot, resolve, reject }); // a writer is running; it takes this one next
      return;
    }
    perShortlist.set(shortlistId, [{ voterId, ballot, resolve, reject }]);
    void drain(db, perShortlist, shortlistId);
  });
}

async function drain(db: Db, perShortlist: Map<string, Pending[]>, shortlistId: string): Promise<void> {
  const queue = perShortlist.get(shortlistId)!;
  while (queue.length > 0) {
    // One turn of the event loop first: PGlite runs a whole transaction without yielding to I/O,
    // so ballots already received would otherwise never find one running to wait behind.
    await new Promise((resolve) => setImmediate(resolve));
    const batch: Pending[] = [];
    const later: Pending[] = [];
    const voters = new Set<string>();
    for (const item of queue.splice(0)) {
      if (voters.has(item.voterId)) later.push(item);
      else {
        voters.add(item.voterId);
        batch.push(item);
      }
    }
    queue.unshift(...later);
    await writeBatch(db, shortlistId, batch);
  }
  perShortlist.delete(shortlistId); // no await since the length check: nothing can slip in between
}

function settle(item: Pending, outcome: Outcome): void {
  if (outcome instanceof ShortlistRuleError) item.reject(outcome);
  else item.resolve(outcome);
}

async function writeBatch(db: Db, shortlistId: string, batch: Pending[]): Promise<void> {
  try {
    const outcomes = await db.transaction((tx) => writeBallots(tx, shortlistId, batch));
    batch.forEach((item, i) => settle(item, outcomes[i]!));
  } catch (error) {
    if (batch.length === 1) return batch[0]!.reject(error);
    // Something no rule foresees (a constraint, a lost connection) failed the shared transaction:
    // each ballot then gets a transaction of its own, so one cannot sink the others.
    for (const item of batch) {
      try {
        settle(item, (await db.transaction((tx) => writeBallots(tx, shortlistId, [item])))[0]!);
      } catch (single) {
        item.reject(single);
      }
    }
  }
}

/** Checks and writes ballots of distinct voters in one transaction; one outcome per ballot. */
async function writeBallots(tx: Tx, shortlistId: string, items: Pending[]): Promise<Outcome[]> {
  // One statement locks the shortlist row and reads the invitations and the live candidates.
  const result = await tx.execute(sql`
    select s.status, s.deadline,
      (select coalesce(array_agg(v.user_id), '{}') from shortlist_voters v where v.shortlist_id = s.id and v.user_id in ${items.map((i) => i.voterId)}) as invited,
      (select coalesce(array_agg(c.id order by c.id), '{}') from candidates c where c.shortlist_id = s.id and c.removed_at is null) as live
    from shortlists s where s.id = ${shortlistId} for update of s`);
  const row = ((result as unknown as { rows?: unknown[] }).rows ?? (result as unknown as unknown[]))[0] as
    | { status: string; deadline: string | Date | null; invited: string[] | null; live: string[] | null }
    | undefined;
  const shared = !row
    ? new ShortlistRuleError(404, 'No shortlist with this id.')
    : row.status !== 'voting'
      ? new ShortlistRuleError(409, `Voting is not open: the shortlist is ${row.status}.`)
      : row.deadline && new Date(row.deadline).getTime() <= Date.now()
        ? new ShortlistRuleError(409, 'The voting deadline has passed.')
        : null;
  if (shared) return items.map(() => shared);
  const invited = new Set(row!.invited ?? []);
  const live = new Set(row!.live ?? []);
  const outcomes: Outcome[] = items.map(({ voterId, ballot }) => {
    if (!invited.has(voterId)) return new ShortlistRuleError(403, 'You are not invited to vote on this shortlist.');
    if (ballot.ranking.length !== live.size || !ballot.ranking.every((id) => live.has(id))) {
      return new ShortlistRuleError(400, `The ranking must name each of the ${live.size} candidates exactly once.`);
    }
    if (!ballot.concerns.every((c) => live.has(c.candidateId))) return new ShortlistRuleError(400, 'A concern names a candidate that is not on this shortlist.');
    return { changed: false };
  });
  const accepted = items.filter((_, i) => !(outcomes[i] instanceof ShortlistRuleError));
  if (accepted.length === 0) return outcomes;
  // xmax = 0 on a returned row tells an insert from an update of the voter's existing ballot.
  const now = new Date();
  const saved = await tx
    .insert(ballots)
    .values(accepted.map(({ voterId, ballot }) => ({ id: newId(), shortlistId, voterId, ranking: ballot.ranking, concerns: ballot.concerns, comment: ballot.comment })))
    .onConflictDoUpdate({
      target: [ballots.shortlistId, ballots.voterId],
      set: { ranking: sql`excluded.ranking`, concerns: sql`excluded.concerns`, comment: sql`excluded.comment`, updatedAt: now },
    })
    .returning({ voterId: ballots.voterId, inserted: sql<boolean>`(xmax = 0)` });
  if (saved.length !== accepted.length) throw new Error(`ballot write returned ${saved.length} rows for ${accepted.length} ballots`);
  const changed = new Map(saved.map((s) => [s.voterId, !s.inserted]));
  await recordAudits(
    tx,
    accepted.map(({ voterId, ballot }) => ({
      actorId: voterId,
      action: changed.get(voterId) ? 'ballot.changed' : 'ballot.cast',
      entityType: 'shortlist',
      entityId: shortlistId,
      details: { concerns: ballot.concerns.length },
    })),
  );
  return items.map((item, i) => (outcomes[i] instanceof ShortlistRuleError ? outcomes[i]! : { changed: changed.get(item.voterId)! }));
}
