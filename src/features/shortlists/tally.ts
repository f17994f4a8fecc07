/**
 * Borda count with first preferences: on a ballot ranking n candidates, the one in position
 * k (0-based) gets n − 1 − k points (J.-C. de Borda, 1781; the common "n − 1 for first" form).
 */
export interface TallyBallot {
  voterName: string;
  ranking: string[];
  concerns: { candidateId: string; reason: string }[];
}

export interface CandidateTally {
  candidateId: string;
  borda: number;
  firstPreferences: number;
  concerns: { voterName: string; reason: string }[];
}

export interface Tally {
  ballots: number;
  candidates: CandidateTally[];
}

/** Tallies ballots over `candidateIds`; result sorted by Borda points, then first preferences. */
export function tallyBallots(candidateIds: string[], ballots: TallyBallot[]): Tally {
  const n = candidateIds.length;
  const rows = new Map<string, CandidateTally>(candidateIds.map((id) => [id, { candidateId: id, borda: 0, firstPreferences: 0, concerns: [] }]));
  for (const ballot of ballots) {
    ballot.ranking.forEach((id, position) => {
      const row = rows.get(id);
      if (!row) return;
      row.borda += n - 1 - position;
      if (position === 0) row.firstPreferences += 1;
    });
    for (const concern of ballot.concerns) rows.get(concern.candidateId)?.concerns.push({ voterName: ballot.voterName, reason: concern.reason });
  }
  const order = new Map(candidateIds.map((id, i) => [id, i]));
  return {
    ballots: ballots.length,
    candidates: [...rows.values()].sort((a, b) => b.borda - a.borda || b.firstPreferences - a.firstPreferences || order.get(a.candidateId)! - order.get(b.candidateId)!),
  };
}
