import type { Db } from '../../db/client';
import type { CandidateSnapshot } from '../../db/schema';
import type { SpecDetail } from '../../db/queries/specs';
import { ENGINE_VERSION, evaluateNormalised, parseSpecInput, type NormalisedSpec, type PartsLibrary, type SchemeId } from '../../engine';
import { currentLibrary, libraryAt } from '../parts/library.server';
import { buildNetlist } from './netlist';
import { netlistPoint, type VinCase } from './operating-point';
import { netlistFilename } from './query';

export type NetlistOutcome = { ok: true; filename: string; text: string } | { ok: false; status: 404 | 422; message: string };

function draw(name: string, spec: NormalisedSpec, scheme: SchemeId, vin: VinCase, library: PartsLibrary, libraryVersion: string): NetlistOutcome {
  const comparison = evaluateNormalised({ ...spec, schemes: [scheme] }, library);
  const result = comparison.results[0]!;
  try {
    const point = netlistPoint(comparison.input, result, vin, library);
    const text = buildNetlist(point, { specName: name, engineVersion: ENGINE_VERSION, libraryName: `${library.name}, version ${libraryVersion}${library.demo ? ' (invented demo data)' : ''}` });
    return { ok: true, filename: netlistFilename(name, scheme, vin), text };
  } catch (error) {
    if (error instanceof RangeError) return { ok: false, status: 422, message: error.message };
    throw error;
  }
}

/** Netlist of one scheme of a saved requirement set (with its saved overrides) against the current parts library. */
export async function specNetlist(db: Db, spec: SpecDetail, scheme: SchemeId, vin: VinCase): Promise<NetlistOutcome> {
  const parsed = parseSpecInput(spec.requirements);
  if (!parsed.ok) return { ok: false, status: 422, message: `The saved requirement set does not validate: ${parsed.errors.map((e) => e.message).join('; ')}` };
  const { library, version } = await currentLibrary(db);
  return draw(spec.name, parsed.value, scheme, vin, library, String(version));
}

/**
 * Netlist of a shortlist candidate from its newest frozen snapshot: the normalised requirement set
 * (with the candidate's overrides) the server froze, against the parts-library version it used.
 */
export async function candidateNetlist(db: Db, name: string, scheme: SchemeId, frozenInput: CandidateSnapshot['input'], libraryVersion: string | null, vin: VinCase): Promise<NetlistOutcome> {
  // Written by freezeCandidate from evaluateNormalised's own `input`; rows from before that may lack it.
  const spec = frozenInput;
  if (!Array.isArray(spec.schemes) || typeof spec.vinMinV !== 'number') return { ok: false, status: 422, message: 'The candidate has no usable frozen requirement set; re-evaluate it first.' };
  const stored = libraryVersion !== null && /^\d+$/.test(libraryVersion) ? await libraryAt(db, Number(libraryVersion)) : undefined;
  const { library, version } = stored ?? (await currentLibrary(db));
  return draw(name, spec, scheme, vin, library, String(version));
}
