import { ENGINE_VERSION, SCHEME_LABELS } from '../../engine';
import type { Db } from '../../db/client';
import { getSpec } from '../../db/queries/specs';
import { getShortlist, loadShortlistParts } from '../../db/queries/shortlists';
import { users } from '../../db/schema';
import { eq } from 'drizzle-orm';
import type { SignedInUser } from '../../lib/server/auth';
import { tallyBallots } from './tally';
import type { CandidateView, ShortlistView } from './types';

export type { CandidateView, ShortlistView } from './types';

/** Sales read decided shortlists only; everyone else reads all. */
export function mayRead(user: SignedInUser, status: ShortlistView['status']): boolean {
  return user.role !== 'sales' || status === 'decided';
}

/** No herding: a voter sees the tally once they have voted; everyone sees it after close. */
export function maySeeTally(status: ShortlistView['status'], hasVoted: boolean): boolean {
  return status === 'closed' || status === 'decided' || (status === 'voting' && hasVoted);
}

/** The shortlist as the caller may see it; undefined when it does not exist. */
export async function shortlistView(db: Db, id: string, user: SignedInUser): Promise<ShortlistView | undefined> {
  const row = await getShortlist(db, id);
  if (!row) return undefined;
  const [spec, parts, [owner], [decider]] = await Promise.all([
    getSpec(db, row.specId),
    loadShortlistParts(db, id),
    db.select({ name: users.displayName }).from(users).where(eq(users.id, row.ownerId)),
    row.decidedById ? db.select({ name: users.displayName }).from(users).where(eq(users.id, row.decidedById)) : Promise.resolve([]),
  ]);
  const candidatesView: CandidateView[] = parts.live.map((c) => {
    const own = parts.snapshots.filter((s) => s.candidateId === c.id);
    const latest = own[own.length - 1]!;
    const staleReasons: string[] = [];
    if (latest.engineVersion !== ENGINE_VERSION) staleReasons.push(`computed with engine ${latest.engineVersion}; the engine is now ${ENGINE_VERSION}`);
    if (spec && latest.specVersion !== spec.version) staleReasons.push(`frozen from spec version ${latest.specVersion}; the spec is now version ${spec.version}`);
    return {
      id: c.id,
      scheme: c.scheme,
      label: SCHEME_LABELS[c.scheme] ?? c.scheme,
      note: c.note,
      overrides: c.overrides,
      result: latest.result,
      variant: {
        activeClampVariant: latest.input.activeClampVariant === 'low-side' ? 'low-side' : 'high-side',
        rectifier: latest.input.rectifier === 'synchronous' ? 'synchronous' : 'diode',
      },
      snapshot: { engineVersion: latest.engineVersion, specVersion: latest.specVersion, partsLibraryVersion: latest.partsLibraryVersion, createdAt: latest.createdAt.toISOString() },
      snapshotCount: own.length,
      staleReasons,
    };
  });
  const mine = parts.ballots.find((b) => b.ballot.voterId === user.id)?.ballot;
  const invited = parts.voters.some((v) => v.id === user.id);
  const view: ShortlistView = {
    id: row.id,
    title: row.title,
    status: row.status,
    spec: { id: row.specId, name: spec?.name ?? '(missing)', version: spec?.version ?? 0, customer: spec?.customer ?? '' },
    owner: { id: row.ownerId, name: owner?.name ?? '' },
    deadline: row.deadline?.toISOString() ?? null,
    openedAt: row.openedAt?.toISOString() ?? null,
    closedAt: row.closedAt?.toISOString() ?? null,
    decision: row.decidedCandidateId && row.decidedAt
      ? { candidateId: row.decidedCandidateId, rationale: row.rationale ?? '', decidedBy: decider?.name ?? null, decidedAt: row.decidedAt.toISOString() }
      : null,
    candidates: candidatesView,
    voters: parts.voters.map((v) => ({ ...v, voted: parts.ballots.some((b) => b.ballot.voterId === v.id) })),
    ballotCount: parts.ballots.length,
    myBallot: mine ? { ranking: mine.ranking, concerns: mine.concerns, comment: mine.comment, updatedAt: mine.updatedAt.toISOString() } : null,
    canVote: invited && row.status === 'voting' && (!row.deadline || row.deadline.getTime() > Date.now()),
    history: parts.history.map((h) => ({ action: h.action, actor: h.actorName, at: h.at.toISOString(), details: h.details })),
  };
  if (maySeeTally(row.status, Boolean(mine))) {
    view.tally = tallyBallots(
      candidatesView.map((c) => c.id),
      parts.ballots.map((b) => ({ voterName: b.voterName, ranking: b.ballot.ranking, concerns: b.ballot.concerns })),
    );
  }
  return view;
}
