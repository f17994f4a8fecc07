import './zod-browser';
import { z } from 'zod';
import { SCHEME_IDS } from '../engine/scheme-ids';

/**
 * The ONE schema of a requirement set for `evaluate` — shared by the API, the forms and the CLI.
 * SI units; every optional field documents its default (also tabled in src/engine/README.md).
 */

const num = (min: number, max: number): z.ZodNumber => z.number().min(min).max(max);

/** Per-scheme overrides used by sweeps and shortlists. */
export const schemeOverrideSchema = z.strictObject({
  turnsRatio: num(0.001, 100).optional().describe('Ns/Np instead of the value derived at the duty limit'),
  dutyLimit: num(0.05, 0.95).optional().describe('design duty limit instead of the scheme default'),
  turnsPrimary: z.number().int().min(1).max(1000).optional().describe('primary turns instead of the designed value'),
  partIds: z.strictObject({
    mainSwitch: z.string().min(1).optional(),
    auxSwitch: z.string().min(1).optional(),
    rectifier: z.string().min(1).optional(),
    core: z.string().min(1).optional(),
  }).optional().describe('library part ids to use instead of the automatic choice'),
});

const weightsSchema = z.strictObject({
  stress: num(0, 100).default(0.25),
  dutyHeadroom: num(0, 100).default(0.1),
  partCount: num(0, 100).default(0.15),
  cost: num(0, 100).default(0.25),
  efficiency: num(0, 100).default(0.25),
});

/** Default score weights (sum 1). */
export const DEFAULT_WEIGHTS = { stress: 0.25, dutyHeadroom: 0.1, partCount: 0.15, cost: 0.25, efficiency: 0.25 } as const;

export const specInputSchema = z.strictObject({
  vinMinV: num(1, 1500).describe('lowest input voltage at which the output must be held (incl. hold-up), V'),
  vinNomV: num(1, 1500).describe('nominal input voltage (efficiency is quoted here), V'),
  vinMaxV: num(1, 1500).describe('highest steady input voltage, V'),
  voutV: num(0.5, 1000).describe('output voltage, V'),
  ioutA: num(0.001, 1000).describe('full-load output current, A'),
  fswHz: num(10e3, 5e6).describe('switching frequency, Hz (10 kHz – 5 MHz)'),
  schemes: z.array(z.enum(SCHEME_IDS)).min(1).optional().describe('schemes to evaluate; default all five'),
  rippleRatio: num(0.01, 2).default(0.3).describe('inductor ripple ΔIL/Iout; default 0.3'),
  voutRippleV: num(1e-4, 100).optional().describe('peak-to-peak output ripple, V; default 1 % of voutV'),
  ambientC: num(-55, 125).default(40).describe('ambient temperature, °C; default 40'),
  annualVolume: z.number().int().min(1).max(1e9).default(1000).describe('units per year for price tiers; default 1000'),
  targetEfficiency: num(0.3, 0.999).optional().describe('efficiency target at nominal input, full load; default none'),
  targetUnitCost: num(0, 1e6).optional().describe('power-stage BOM cost target, library currency; default none'),
  rectifier: z.enum(['diode', 'synchronous']).default('diode').describe("output rectifier kind; default 'diode'"),
  maxDuty: num(0.1, 0.95).default(0.75).describe('controller maximum duty; default 0.75'),
  voltageDerating: num(0.3, 1).default(0.8).describe('share of a voltage rating that may be used; default 0.8'),
  leakageRatio: num(0, 0.2).nullable().optional().describe('leakage/magnetizing inductance Llk/Lm instead of the estimate from the transformer build; default none (null: estimated)'),
  windingArrangement: z.enum(['non-interleaved', 'interleaved']).default('non-interleaved')
    .describe("transformer windings, for the leakage estimate: 'interleaved' splits the primary around the secondary (P–S–P); default 'non-interleaved'"),
  resetTurnsRatio: num(0.1, 10).default(1).describe('tertiary Nr/Np; default 1'),
  activeClampVariant: z.enum(['high-side', 'low-side']).default('high-side').describe("active-clamp variant; default 'high-side'"),
  weights: weightsSchema.optional().describe('score weights; default stress 0.25, dutyHeadroom 0.1, partCount 0.15, cost 0.25, efficiency 0.25'),
  overrides: z.strictObject(Object.fromEntries(SCHEME_IDS.map((id) => [id, schemeOverrideSchema.optional()])) as
    Record<(typeof SCHEME_IDS)[number], z.ZodOptional<typeof schemeOverrideSchema>>).optional()
    .describe('per-scheme overrides: turnsRatio, dutyLimit, turnsPrimary, partIds'),
});

/** A requirement set as submitted (optional fields may be missing). */
export type SpecInput = z.input<typeof specInputSchema>;
export type SchemeOverride = z.output<typeof schemeOverrideSchema>;
export type ScoreWeights = z.output<typeof weightsSchema>;

/** A requirement set with every default filled. */
export interface NormalisedSpec extends Omit<z.output<typeof specInputSchema>, 'schemes' | 'voutRippleV' | 'targetEfficiency' | 'targetUnitCost' | 'leakageRatio' | 'weights' | 'overrides'> {
  schemes: (typeof SCHEME_IDS)[number][];
  /** Llk/Lm given by the user; null: estimated from the transformer build (engine/magnetics/leakage.ts). */
  leakageRatio: number | null;
  voutRippleV: number;
  targetEfficiency: number | null;
  targetUnitCost: number | null;
  weights: ScoreWeights;
  overrides: Partial<Record<(typeof SCHEME_IDS)[number], SchemeOverride>>;
}

/** One problem with a requirement set: the field (dotted path) and a plain-English reason. */
export interface SpecError {
  field: string;
  message: string;
}

function valueAt(raw: unknown, path: readonly PropertyKey[]): unknown {
  let v: unknown = raw;
  for (const key of path) v = v !== null && typeof v === 'object' ? (v as Record<PropertyKey, unknown>)[key] : undefined;
  return v;
}

function show(v: unknown): string {
  if (typeof v === 'number') return Number.isNaN(v) ? 'NaN' : String(v);
  if (typeof v === 'string') return JSON.stringify(v);
  if (v === undefined) return 'missing';
  return JSON.stringify(v) ?? String(v);
}

function describeIssue(issue: z.core.$ZodIssue, raw: unknown): SpecError[] {
  const field = issue.path.map(String).join('.') || '(input)';
  const value = valueAt(raw, issue.path);
  switch (issue.code) {
    case 'unrecognized_keys':
      return issue.keys.map((k) => ({ field: [...issue.path.map(String), k].join('.'), message: `${[...issue.path.map(String), k].join('.')} is not a known field` }));
    case 'invalid_type':
      if (value === undefined) return [{ field, message: `${field} is required` }];
      if (typeof value === 'number' && issue.expected === 'number') return [{ field, message: `${field} (${show(value)}) must be a finite number` }];
      if (issue.expected === 'int') return [{ field, message: `${field} (${show(value)}) must be a whole number` }];
      return [{ field, message: `${field} must be ${issue.expected === 'object' ? 'an object' : `a ${issue.expected}`}, got ${show(value)}` }];
    case 'too_small':
      return [{ field, message: issue.origin === 'array' ? `${field} must list at least ${String(issue.minimum)} item` : `${field} (${show(value)}) must be at least ${String(issue.minimum)}` }];
    case 'too_big':
      return [{ field, message: `${field} (${show(value)}) must be at most ${String(issue.maximum)}` }];
    case 'invalid_value':
      return [{ field, message: `${field} (${show(value)}) must be one of ${issue.values.map((v) => show(v)).join(', ')}` }];
    default:
      return [{ field, message: `${field} (${show(value)}) is not valid: ${issue.message}` }];
  }
}

function crossFieldErrors(s: NormalisedSpec): SpecError[] {
  const errors: SpecError[] = [];
  if (s.vinMinV > s.vinMaxV) errors.push({ field: 'vinMinV', message: `vinMinV (${s.vinMinV}) must not exceed vinMaxV (${s.vinMaxV})` });
  else if (s.vinNomV < s.vinMinV || s.vinNomV > s.vinMaxV) {
    errors.push({ field: 'vinNomV', message: `vinNomV (${s.vinNomV}) must lie between vinMinV (${s.vinMinV}) and vinMaxV (${s.vinMaxV})` });
  }
  if (s.voutRippleV >= s.voutV) errors.push({ field: 'voutRippleV', message: `voutRippleV (${s.voutRippleV}) must be smaller than voutV (${s.voutV})` });
  if (s.voutV * s.ioutA > 20e3) errors.push({ field: 'ioutA', message: `output power voutV × ioutA (${+(s.voutV * s.ioutA).toFixed(1)} W) must be at most 20000 W` });
  const w = s.weights;
  if (w.stress + w.dutyHeadroom + w.partCount + w.cost + w.efficiency <= 0) errors.push({ field: 'weights', message: 'weights must not all be zero' });
  if (new Set(s.schemes).size !== s.schemes.length) errors.push({ field: 'schemes', message: 'schemes must not list a scheme twice' });
  return errors;
}

/**
 * Validate and normalise a raw requirement set. Never throws; errors name the field and reason
 * in plain English, e.g. `vinMinV (400) must not exceed vinMaxV (300)`.
 */
export function parseSpecInput(raw: unknown): { ok: true; value: NormalisedSpec } | { ok: false; errors: SpecError[] } {
  if (raw === null || typeof raw !== 'object' || Array.isArray(raw)) {
    return { ok: false, errors: [{ field: '(input)', message: 'the requirement set must be a JSON object' }] };
  }
  const parsed = specInputSchema.safeParse(raw);
  if (!parsed.success) return { ok: false, errors: parsed.error.issues.flatMap((i) => describeIssue(i, raw)) };
  const p = parsed.data;
  const value: NormalisedSpec = {
    ...p,
    schemes: p.schemes ?? [...SCHEME_IDS],
    voutRippleV: p.voutRippleV ?? 0.01 * p.voutV,
    targetEfficiency: p.targetEfficiency ?? null,
    targetUnitCost: p.targetUnitCost ?? null,
    leakageRatio: p.leakageRatio ?? null,
    weights: p.weights ?? { ...DEFAULT_WEIGHTS },
    overrides: p.overrides ?? {},
  };
  const errors = crossFieldErrors(value);
  return errors.length > 0 ? { ok: false, errors } : { ok: true, value };
}
