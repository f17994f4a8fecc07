import type { Comparison, SchemeResult } from '../../engine';
import type { SchemeId } from '../../engine/scheme-ids';
import { isHazardous } from '../../lib/safety';
import type { BriefDraft } from '../../schemas/briefs';
import { verdictOf, type Verdict } from '../../lib/verdict';
import type { BriefContent, BriefCost, BriefRecommendation } from '../../schemas/brief-content';
import { assumptionLines, keyFigures, requirementLines, riskLines } from './lines';
import { verdictReasons } from './reasons';
import { defaultSummary } from './summary';

export interface BriefMeta {
  title: string;
  customerName: string;
  customerContact: string;
  preparedBy: { name: string; email: string; company: string | null };
  spec: { id: string; name: string; version: number };
  demo: boolean;
  shortlist: BriefContent['shortlist'];
}

const CLEAN_REASON = 'Every checked limit holds with margin.';

/**
 * The recommended scheme: the author's choice if it is feasible, else the decided shortlist's
 * scheme if feasible, else the engine ranking's best feasible scheme (none when nothing is).
 */
export function pickRecommendation(comparison: Comparison, draft: BriefDraft, decided: SchemeId | null): { scheme: SchemeId | null; source: BriefRecommendation['source']; notices: string[] } {
  const feasible = (id: SchemeId | null): boolean => id !== null && comparison.results.some((r) => r.scheme === id && r.feasible);
  const label = (id: SchemeId): string => comparison.results.find((r) => r.scheme === id)?.label ?? id;
  const notices: string[] = [];
  if (draft.recommendedScheme !== null) {
    if (feasible(draft.recommendedScheme)) return { scheme: draft.recommendedScheme, source: 'edited', notices };
    notices.push(`The chosen scheme (${label(draft.recommendedScheme)}) is not feasible for this requirement set any more; the brief falls back to the best feasible one.`);
  }
  if (decided !== null) {
    if (feasible(decided)) return { scheme: decided, source: 'shortlist', notices };
    notices.push(`The scheme decided on the shortlist (${label(decided)}) is not feasible with the current engine and parts library.`);
  }
  const best = comparison.ranking.find((id) => feasible(id)) ?? null;
  return { scheme: best, source: 'engine', notices };
}

/** Unit-cost band around the power-stage BOM: bom·(1 − low %) … bom·(1 + high %). */
export function costBand(result: SchemeResult, annualVolume: number, lowPct: number, highPct: number): BriefCost {
  return {
    currency: result.currency,
    annualVolume,
    bomCost: result.bomCost,
    lowPct,
    highPct,
    low: result.bomCost * (1 - lowPct / 100),
    high: result.bomCost * (1 + highPct / 100),
    covers: [...new Set(result.parts.map((p) => p.role.replaceAll('-', ' ')))],
  };
}

/** The whole brief from one comparison and the author's draft; pure, so tests and previews share it. */
export function composeBrief(comparison: Comparison, draft: BriefDraft, meta: BriefMeta): BriefContent {
  const input = comparison.input;
  const byScheme = new Map(comparison.results.map((r) => [r.scheme, r]));
  const ordered = comparison.ranking.map((id) => byScheme.get(id)).filter((r): r is SchemeResult => r !== undefined);
  const counts: Record<Verdict, number> = { feasible: 0, marginal: 0, 'not-feasible': 0 };
  const verdicts = ordered.map((r) => {
    const verdict = verdictOf(r);
    counts[verdict] += 1;
    const reasons = verdictReasons(r.findings);
    return { scheme: r.scheme, label: r.label, verdict, reasons: reasons.length > 0 ? reasons : [CLEAN_REASON] };
  });
  const pick = pickRecommendation(comparison, draft, meta.shortlist?.decidedScheme ?? null);
  const chosen = pick.scheme === null ? undefined : byScheme.get(pick.scheme);
  const recommended: BriefRecommendation | null = chosen
    ? { scheme: chosen.scheme, label: chosen.label, verdict: verdictOf(chosen), source: pick.source, figures: keyFigures(chosen, input) }
    : null;
  const cost = chosen ? costBand(chosen, input.annualVolume, draft.contingencyLowPct, draft.contingencyHighPct) : null;
  const partial: Omit<BriefContent, 'summary'> = {
    format: 1,
    title: meta.title,
    customerName: meta.customerName,
    customerContact: meta.customerContact,
    preparedBy: meta.preparedBy,
    spec: meta.spec,
    engineVersion: comparison.engineVersion,
    partsLibrary: comparison.partsLibrary,
    demo: meta.demo || comparison.partsLibrary.demo,
    hazardous: isHazardous(input.vinMaxV),
    requirements: requirementLines(input, comparison.partsLibrary.currency),
    verdicts,
    counts,
    recommended,
    cost,
    risks: riskLines(chosen, draft.risksText),
    assumptions: assumptionLines(comparison, draft.assumptionsText),
    shortlist: meta.shortlist,
    notices: pick.notices,
    chart: ordered.map((r) => ({ scheme: r.scheme, label: r.label, verdict: verdictOf(r), stressV: r.switchStressV, ratingV: r.switchRatingV })),
  };
  return { ...partial, summary: draft.summary ?? defaultSummary(partial, input) };
}
