/**
 * Public API of the Resetwise calculation engine. Pure TypeScript, SI units, browser-safe
 * (no Node, Astro, React or database imports) so server, islands, Web Workers and the CLI share it.
 */
export { ENGINE_VERSION } from './version';
export { SCHEME_IDS, SCHEME_LABELS, type SchemeId } from './scheme-ids';
export { evaluate, evaluateNormalised, evaluateLean, LeanSweeper, rankResults, SpecValidationError } from './evaluate';
export { waveforms, waveformsOf, type Waveforms, type WavePoint } from './waveforms';
export { sweepVin, type VinSweepPoint } from './sweep';
export { demoPartsLibrary } from './parts/demo-library';
export { indexLibrary, unitPriceAt } from './parts/index-library';
export type * from './parts/types';
export type { Comparison, SchemeResult, LeanResult, BomLine } from './result-types';
export type { Finding } from './feasibility';
export type { TraceEntry, TraceInput } from './trace';
export type { LossesW } from './design/types';
export { parseSpecInput, specInputSchema, type NormalisedSpec, type SpecInput, type SpecError } from '../schemas/spec';
export { E6, E12, E24, snapUp, snapDown } from './eseries';
