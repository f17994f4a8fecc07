import type { SchemeResult } from '../engine';

/**
 * The verdict on one scheme for a reader (Compare's cards, briefs, mail): the same rule everywhere, on the client and the
 * server alike.
 */
export type Verdict = 'feasible' | 'marginal' | 'not-feasible';

/** Feasible with no warning; marginal when something is near a limit; not feasible on any fail. */
export function verdictOf(result: SchemeResult): Verdict {
  if (!result.feasible) return 'not-feasible';
  return result.findings.some((f) => f.severity === 'warn') ? 'marginal' : 'feasible';
}

export const VERDICT_LABELS: Record<Verdict, string> = { feasible: 'Feasible', marginal: 'Marginal', 'not-feasible': 'Not feasible' };
