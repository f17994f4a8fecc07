import type { Db } from '../../db/client';
import { getSpec, listSpecSummaries } from '../../db/queries/specs';
import { parseSpecInput, type NormalisedSpec, type PartsLibrary } from '../../engine';
import { isHazardous } from '../../lib/safety';
import { currentLibrary } from '../parts/library.server';
import { formatSi } from '../../lib/si';

export interface SweepPageData {
  spec: { id: string; name: string; customer: string; version: number };
  normalised: NormalisedSpec | null;
  problems: string[];
  library: PartsLibrary;
  libraryVersion: number;
}

/** Everything the Sweep page of one saved set needs; undefined when the set does not exist. */
export async function sweepPageData(db: Db, id: string): Promise<SweepPageData | undefined> {
  const row = await getSpec(db, id);
  if (!row) return undefined;
  const parsed = parseSpecInput(row.requirements);
  const { library, version } = await currentLibrary(db);
  return {
    spec: { id: row.id, name: row.name, customer: row.customer, version: row.version },
    normalised: parsed.ok ? parsed.value : null,
    problems: parsed.ok ? [] : parsed.errors.map((e) => e.message),
    library, libraryVersion: version,
  };
}

/** Rows of the set picker: active sets with a one-line summary of their requirements. */
export async function sweepPickerRows(db: Db): Promise<{ id: string; name: string; customer: string; summary: string; hazardous: boolean }[]> {
  return (await listSpecSummaries(db)).map((s) => {
    const parsed = parseSpecInput(s.requirements);
    const r = parsed.ok ? parsed.value : null;
    return {
      id: s.id, name: s.name, customer: s.customer,
      summary: r ? `${formatSi(r.vinMinV, 'V')}–${formatSi(r.vinMaxV, 'V')} → ${formatSi(r.voutV, 'V')}, ${formatSi(r.voutV * r.ioutA, 'W')}, ${formatSi(r.fswHz, 'Hz')}` : 'requirements need fixing on Compare',
      hazardous: r ? isHazardous(r.vinMaxV) : false,
    };
  });
}
