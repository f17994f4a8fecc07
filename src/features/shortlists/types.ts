import type { SchemeId, SchemeResult } from '../../engine';
import type { Tally } from './tally';

export interface CandidateView {
  id: string;
  scheme: SchemeId;
  label: string;
  note: string;
  overrides: Record<string, unknown>;
  result: SchemeResult;
  /** Drawing options of the snapshot's requirement set. */
  variant: { activeClampVariant: 'high-side' | 'low-side'; rectifier: 'diode' | 'synchronous' };
  snapshot: { engineVersion: string; specVersion: number; partsLibraryVersion: string | null; createdAt: string };
  snapshotCount: number;
  /** Why the frozen result may no longer match the spec and engine; empty when current. */
  staleReasons: string[];
}

export interface ShortlistView {
  id: string;
  title: string;
  status: 'draft' | 'voting' | 'closed' | 'decided' | 'withdrawn';
  spec: { id: string; name: string; version: number; customer: string };
  owner: { id: string; name: string };
  deadline: string | null;
  openedAt: string | null;
  closedAt: string | null;
  decision: { candidateId: string; rationale: string; decidedBy: string | null; decidedAt: string } | null;
  candidates: CandidateView[];
  voters: { id: string; name: string; role: string; voted: boolean }[];
  ballotCount: number;
  myBallot: { ranking: string[]; concerns: { candidateId: string; reason: string }[]; comment: string; updatedAt: string } | null;
  /** The caller may cast or change a ballot now. */
  canVote: boolean;
  /** Present only when the caller may see results (after voting, or after close). */
  tally?: Tally;
  history: { action: string; actor: string | null; at: string; details: Record<string, unknown> }[];
}

