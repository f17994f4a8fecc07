import { evaluateLean, SCHEME_IDS, type LeanResult, type NormalisedSpec, type PartsLibrary, type SchemeId } from '../../engine';

/** What the user chose to vary. Frequencies in Hz. */
export interface SweepSettings {
  schemes: SchemeId[];
  fswMinHz: number;
  fswMaxHz: number;
  fswSteps: number;
  dutySteps: number;
  varyMainSwitch: boolean;
  varyRectifier: boolean;
  varyCore: boolean;
}

/** The grid one sweep walks: per scheme its duty limits, shared frequencies and part choices (null = the engine's own choice). */
export interface SweepPlan {
  schemes: SchemeId[];
  fswHz: number[];
  dutyLimits: number[][];
  /** Main-switch choices per scheme (each scheme needs its own voltage class). */
  mainSwitches: (string | null)[][];
  rectifiers: (string | null)[];
  cores: (string | null)[];
  total: number;
}

export const DEFAULT_SETTINGS: SweepSettings = {
  schemes: [...SCHEME_IDS], fswMinHz: 50e3, fswMaxHz: 500e3, fswSteps: 8, dutySteps: 5,
  varyMainSwitch: true, varyRectifier: true, varyCore: true,
};

/** Plain messages for settings the sweep cannot run with (empty when fine). */
export function settingsProblems(s: SweepSettings): string[] {
  const out: string[] = [];
  if (s.schemes.length === 0) out.push('Pick at least one reset scheme.');
  if (!(s.fswMinHz >= 10e3 && s.fswMaxHz <= 5e6)) out.push('Frequencies must lie between 10 kHz and 5 MHz.');
  if (!(s.fswMinHz <= s.fswMaxHz)) out.push('The lowest frequency must not exceed the highest.');
  if (!(Number.isInteger(s.fswSteps) && s.fswSteps >= 1 && s.fswSteps <= 40)) out.push('Frequency steps must be a whole number from 1 to 40.');
  if (!(Number.isInteger(s.dutySteps) && s.dutySteps >= 1 && s.dutySteps <= 20)) out.push('Duty-limit steps must be a whole number from 1 to 20.');
  return out;
}

/** Each scheme's own design for the last spec and library planned (the page plans again on every settings edit; specs and libraries are never changed in place). */
let defaultsOf: { spec: NormalisedSpec; library: PartsLibrary; byScheme: Map<SchemeId, LeanResult> } | null = null;

function defaultDesign(spec: NormalisedSpec, library: PartsLibrary, scheme: SchemeId): LeanResult {
  if (!defaultsOf || defaultsOf.spec !== spec || defaultsOf.library !== library) defaultsOf = { spec, library, byScheme: new Map() };
  let r = defaultsOf.byScheme.get(scheme);
  if (!r) {
    r = evaluateLean(spec, scheme, library);
    defaultsOf.byScheme.set(scheme, r);
  }
  return r;
}

/** Log-spaced frequencies (equal ratios, as a designer steps frequency). */
export function frequencies(minHz: number, maxHz: number, steps: number): number[] {
  if (steps === 1 || minHz === maxHz) return [minHz];
  return Array.from({ length: steps }, (_, k) => Math.round(minHz * (maxHz / minHz) ** (k / (steps - 1))));
}

/**
 * Builds the grid. Duty limits run from 60 % of each scheme's own design limit up to it (a higher
 * limit would break its reset); main switches are usable N-MOSFETs of the lowest voltage classes
 * that can carry the scheme's stress; rectifiers the kind the spec asks for; all usable cores.
 * Parts marked not-for-new-designs are left out.
 */
export function planSweep(spec: NormalisedSpec, library: PartsLibrary, s: SweepSettings): SweepPlan {
  const usable = <T extends { status: string }>(parts: T[]): T[] => parts.filter((p) => p.status !== 'nfnd');
  const fswHz = frequencies(s.fswMinHz, s.fswMaxHz, s.fswSteps);
  const defaults = s.schemes.map((scheme) => defaultDesign(spec, library, scheme));
  const dutyLimits = defaults.map((r) => {
    if (s.dutySteps === 1) return [r.dutyLimit];
    return Array.from({ length: s.dutySteps }, (_, k) => r.dutyLimit * (0.6 + (0.4 * k) / (s.dutySteps - 1)));
  });
  // Per scheme, the six lowest voltage classes that can carry 75 % of its default stress after derating
  // (a lower duty limit can lower the stress of some schemes); higher classes only add cost and loss.
  const nMos = usable(library.mosfets).filter((m) => m.channel === 'n').sort((a, b) => a.vdsV - b.vdsV || a.rdsOnOhm - b.rdsOnOhm);
  const mainSwitches = defaults.map((r) => {
    if (!s.varyMainSwitch) return [null];
    const need = (0.75 * r.switchStressV) / spec.voltageDerating;
    const fit = nMos.filter((m) => m.vdsV >= need);
    const classes = [...new Set(fit.map((m) => m.vdsV))].slice(0, 3);
    const picked = fit.filter((m) => classes.includes(m.vdsV)).slice(0, 6).map((m) => m.id);
    return picked.length > 0 ? picked : [null];
  });
  const rectParts = (spec.rectifier === 'synchronous' ? library.srMosfets : library.rectifiers) as { id: string; status: string }[];
  const rectifiers = s.varyRectifier ? usable(rectParts).map((r) => r.id) : [];
  const cores = s.varyCore ? usable(library.cores).map((c) => c.id) : [];
  const r = Math.max(1, rectifiers.length), c = Math.max(1, cores.length);
  const total = mainSwitches.reduce((sum, m) => sum + fswHz.length * s.dutySteps * m.length * r * c, 0);
  return {
    schemes: [...s.schemes], fswHz, dutyLimits, mainSwitches,
    rectifiers: rectifiers.length ? rectifiers : [null], cores: cores.length ? cores : [null], total,
  };
}

/**
 * A copy of `plan` made of this thread's own values: every scheme id from SCHEME_IDS, every part id the string of
 * `library`'s own part, fresh number arrays. A worker runs each plan through it, the warm-up's as well as each
 * Run's: a Run's plan arrives by structured clone, with new strings and arrays of other element kinds than those
 * `planSweep` builds, and the sweep loop the JIT had compiled on the warm-up's plan was deoptimised at each Run's
 * first points ("wrong map", "wrong instance type" in Chromium's --trace-deopt) and finished it in slower code.
 */
export function ownPlan(p: SweepPlan, library: PartsLibrary): SweepPlan {
  const known = new Map<string, string>();
  for (const list of [library.mosfets, library.srMosfets, library.rectifiers, library.cores]) for (const part of list) known.set(part.id, part.id);
  const ids = (list: readonly (string | null)[]): (string | null)[] => list.map((id) => (id === null ? null : known.get(id) ?? id));
  return {
    schemes: p.schemes.map((s) => SCHEME_IDS.find((id) => id === s) ?? s), fswHz: p.fswHz.map(Number), dutyLimits: p.dutyLimits.map((d) => d.map(Number)),
    mainSwitches: p.mainSwitches.map(ids), rectifiers: ids(p.rectifiers), cores: ids(p.cores), total: Number(p.total),
  };
}
