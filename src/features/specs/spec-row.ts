import type { SpecSummary } from '../../db/queries/specs';
import { formatSi, formatSiRange } from '../../lib/si';

export interface SpecRow {
  id: string;
  name: string;
  customer: string;
  owner: string;
  input: string;
  output: string;
  power: string;
  switching: string;
  maxInputV: number;
  updated: string;
  version: number;
  archived: boolean;
  requirements: Record<string, unknown>;
}

const num = (value: unknown): number => (typeof value === 'number' && Number.isFinite(value) ? value : Number.NaN);

/** One line of the requirement-set table, every figure with its unit. */
export function toSpecRow(spec: SpecSummary): SpecRow {
  const r = spec.requirements;
  const vout = num(r.voutV);
  const iout = num(r.ioutA);
  return {
    id: spec.id,
    name: spec.name,
    customer: spec.customer || '—',
    owner: spec.ownerName,
    input: formatSiRange(num(r.vinMinV), num(r.vinMaxV), 'V'),
    output: `${formatSi(vout, 'V')} / ${formatSi(iout, 'A')}`,
    power: formatSi(vout * iout, 'W'),
    switching: formatSi(num(r.fswHz), 'Hz'),
    maxInputV: num(r.vinMaxV),
    updated: spec.updatedAt.toISOString(),
    version: spec.version,
    archived: spec.archivedAt !== null,
    requirements: spec.requirements,
  };
}
