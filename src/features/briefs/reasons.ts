import type { Finding } from '../../engine';

/**
 * Customer wording for the engine's findings: a short plain lead per finding code, followed by
 * the engine's own message (which carries the numbers). Unknown codes keep the engine message.
 */
export const FINDING_LEADS: Readonly<Record<string, string>> = {
  'duty-limit-above-reset': 'The transformer core would not reset every cycle',
  'duty-cannot-reach-output': 'The output cannot be held at the lowest input voltage',
  'no-switch-for-stress': 'No primary switch in our parts library takes the voltage stress',
  'no-aux-switch': 'No clamp switch in our parts library takes the voltage',
  'no-rectifier': 'No output rectifier in our parts library fits',
  'no-core': 'No transformer core in our parts library is large enough',
  'windings-do-not-fit': 'The windings do not fit the transformer core',
  'flux-above-saturation': 'The transformer core would saturate in a high-line transient',
  'resonant-reset-incomplete': 'The resonant reset is too slow at this duty cycle',
  'no-output-capacitor': 'No output capacitor bank in our parts library meets the ripple',
  'no-output-inductor': 'No output inductor in our parts library fits',
  'no-clamp-part': 'No clamp or reset part in our parts library takes the reset energy',
  'unknown-part': 'A chosen part is not in our parts library',
  'leakage-commutation': 'Transformer leakage uses up the duty cycle',
  'efficiency-below-target': 'Efficiency falls short of your target',
  'cost-above-target': 'The power-stage cost is above your target',
  'small-voltage-margin': 'Little voltage headroom on the primary switch',
  'small-flux-margin': 'Little flux headroom in the transformer core',
  'window-nearly-full': 'The transformer winding window is nearly full',
  'short-on-time': 'Very short switch on-time at high input',
  'low-efficiency': 'Efficiency is low for any application',
  'core-data-frequency': 'The switching frequency is outside the core material’s loss data',
  'dcm-at-light-load': 'Discontinuous conduction at light load',
  'unclamped-leakage': 'The leakage-inductance spike needs a snubber',
  'high-line-transient': 'A high-line transient raises the switch voltage',
  'volt-second-clamp': 'The controller needs a volt-second duty clamp',
  'bifilar-insulation': 'Insulation between primary and reset windings needs care',
  'turns-set-by-transient': 'The transformer turns are set by a high-line transient',
  'windings-not-costed': 'The transformer windings are not priced',
};

/** "Lead: engine message." with the first letter of the message kept as the engine wrote it. */
export function plainReason(finding: Finding): string {
  const message = finding.message.trim().replace(/\.$/, '');
  const lead = FINDING_LEADS[finding.code];
  if (!lead) return `${message.charAt(0).toUpperCase()}${message.slice(1)}.`;
  return `${lead}: ${message}.`;
}

/** Reasons behind a verdict: every fail, else every warning; the caller words a clean result. */
export function verdictReasons(findings: Finding[]): string[] {
  const fails = findings.filter((f) => f.severity === 'fail');
  const chosen = fails.length > 0 ? fails : findings.filter((f) => f.severity === 'warn');
  return chosen.map(plainReason);
}
