import { SCHEME_LABELS, type SchemeId } from '../../engine/scheme-ids';

export const STATUS_STYLE: Record<string, string> = {
  draft: 'bg-canvas text-muted',
  voting: 'bg-warn-soft text-warn',
  closed: 'bg-accent-soft text-accent-strong',
  decided: 'bg-ok-soft text-ok',
  withdrawn: 'bg-canvas text-muted line-through',
};

/** One line of the shortlist timeline, in plain words. */
export function describeEvent(event: { action: string; actor: string | null; details: Record<string, unknown> }, labels: Map<string, string>): string {
  const who = event.actor ?? 'Resetwise';
  const d = event.details;
  const scheme = typeof d.scheme === 'string' ? SCHEME_LABELS[d.scheme as SchemeId] ?? d.scheme : labels.get(String(d.candidateId)) ?? 'a candidate';
  switch (event.action) {
    case 'shortlist.created': return `${who} created the shortlist.`;
    case 'candidate.added': return `${who} added ${scheme}${d.note ? ` ("${String(d.note)}")` : ''}.`;
    case 'candidate.removed': return `${who} removed ${scheme}.`;
    case 'candidate.reevaluated': return `${who} re-evaluated ${scheme} (engine ${String(d.engineVersion)}, spec v${String(d.specVersion)}); the earlier snapshot is kept.`;
    case 'voting.opened': return `${who} opened voting to ${String(d.voters)} voter(s) until ${String(d.deadline).slice(0, 16).replace('T', ' ')} UTC.`;
    case 'voting.extended': return `${who} extended voting until ${String(d.deadline).slice(0, 16).replace('T', ' ')} UTC.`;
    case 'ballot.cast': return `${who} cast a ballot${Number(d.concerns) > 0 ? ` with ${String(d.concerns)} blocking concern(s)` : ''}.`;
    case 'ballot.changed': return `${who} changed their ballot.`;
    case 'voting.closed': return `${who} closed voting.`;
    case 'shortlist.decided': return `${who} decided on ${scheme}.`;
    case 'shortlist.withdrawn': return `${who} withdrew the shortlist.`;
    default: return `${who}: ${event.action}.`;
  }
}
