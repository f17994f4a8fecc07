import type { CandidateView } from './types';
import SchemeCard from '../compare/SchemeCard';
import CandidateActions from './CandidateActions';

interface Props {
  shortlistId: string;
  candidate: CandidateView;
  /** Borda rank once the tally is visible. */
  rank: number | null;
  of: number;
  chosen: boolean;
  editable: boolean;
}

/** A frozen candidate: the scheme card of its snapshot, its note, and staleness. */
export default function CandidateCard({ shortlistId, candidate, rank, of, chosen, editable }: Props) {
  return (
    <div className={`flex flex-col gap-1.5 ${chosen ? 'rounded-lg ring-2 ring-accent ring-offset-2 ring-offset-canvas' : ''}`} data-candidate={candidate.scheme}>
      {chosen && <p className="text-sm font-semibold text-accent-strong">Chosen</p>}
      <SchemeCard
        result={candidate.result} rank={rank ?? 0} of={of} stale={false}
        rankText={rank === null ? 'engine score' : `score · ballot rank ${rank} of ${of}`}
        activeClampVariant={candidate.variant.activeClampVariant} rectifier={candidate.variant.rectifier}
        netlistHref={`/api/v1/shortlists/${encodeURIComponent(shortlistId)}/candidates/${encodeURIComponent(candidate.id)}/netlist`}
      />
      <div className="space-y-1 px-1 text-xs">
        {candidate.note && <p><span className="font-semibold">Note:</span> {candidate.note}</p>}
        <p className="text-muted">
          Frozen {candidate.snapshot.createdAt.slice(0, 16).replace('T', ' ')} UTC · engine {candidate.snapshot.engineVersion} · spec v{candidate.snapshot.specVersion}
          {candidate.snapshotCount > 1 ? ` · ${candidate.snapshotCount} snapshots kept` : ''}
        </p>
        {candidate.staleReasons.length > 0 && (
          <p className="rounded bg-warn-soft px-2 py-1 text-warn" data-stale>Stale: {candidate.staleReasons.join('; ')}.</p>
        )}
        {editable && <CandidateActions shortlistId={shortlistId} candidateId={candidate.id} label={candidate.label} stale={candidate.staleReasons.length > 0} />}
      </div>
    </div>
  );
}
