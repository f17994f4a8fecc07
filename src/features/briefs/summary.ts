import type { NormalisedSpec } from '../../engine';
import { formatSi, formatSiRange } from '../../lib/si';
import type { BriefContent } from '../../schemas/brief-content';
import { formatCount, formatMoney } from '../../lib/format';

/** "Two-switch" → "two-switch"; acronyms such as "RCD clamp" stay as they are. */
const inSentence = (label: string): string => (/^[A-Z][a-z]/.test(label) ? label.charAt(0).toLowerCase() + label.slice(1) : label);
const plural = (n: number, one: string, many: string): string => `${n} ${n === 1 ? one : many}`;

/** The generated summary the author starts from (editable before sending). */
export function defaultSummary(b: Omit<BriefContent, 'summary'>, s: NormalisedSpec): string {
  const ask = `${b.customerName} asked whether an isolated forward converter from ${formatSiRange(s.vinMinV, s.vinMaxV, 'V')} to ${formatSi(s.voutV, 'V')} at ${formatSi(s.ioutA, 'A')} (${formatSi(s.voutV * s.ioutA, 'W')}), switching at ${formatSi(s.fswHz, 'Hz')}, can be built.`;
  const total = b.verdicts.length;
  const tally = `Of the ${plural(total, 'core-reset scheme', 'core-reset schemes')} we compared, ${b.counts.feasible} ${b.counts.feasible === 1 ? 'is' : 'are'} feasible, ${b.counts.marginal} marginal and ${b.counts['not-feasible']} not feasible.`;
  if (!b.recommended || !b.cost) {
    return `${ask} ${tally} None meets the requirements as stated; we would like to discuss which requirement could move. This is an early estimate, not a design.`;
  }
  const why = b.recommended.source === 'shortlist'
    ? 'chosen by our engineering team after review'
    : b.recommended.verdict === 'feasible' ? 'which meets every checked limit with margin' : 'which is feasible but close to a limit (see the risks)';
  const rec = `We recommend the ${inSentence(b.recommended.label)} scheme, ${why}.`;
  const price = `Its power-stage parts are estimated at ${formatMoney(b.cost.low, b.cost.currency)} to ${formatMoney(b.cost.high, b.cost.currency)} per unit at ${formatCount(b.cost.annualVolume)} units/year (power-stage BOM only, not a quote).`;
  return `${ask} ${tally} ${rec} ${price} This is an early estimate for trade-off, not a design.`;
}
