import type { SpecDetail, SpecSummary } from '../../db/queries/specs';

export interface SpecJson {
  id: string;
  name: string;
  customer: string;
  owner: { id: string; name: string };
  requirements: Record<string, unknown>;
  version: number;
  archived: boolean;
  engineVersion: string | null;
  createdAt: string;
  updatedAt: string;
  updatedBy: string | null;
}

/** The API's shape of a requirement set (the stored comparison is served on its own route). */
export function toSpecJson(spec: SpecSummary | SpecDetail): SpecJson {
  return {
    id: spec.id,
    name: spec.name,
    customer: spec.customer,
    owner: { id: spec.ownerId, name: spec.ownerName },
    requirements: spec.requirements,
    version: spec.version,
    archived: spec.archivedAt !== null,
    engineVersion: spec.engineVersion,
    createdAt: spec.createdAt.toISOString(),
    updatedAt: spec.updatedAt.toISOString(),
    updatedBy: spec.updatedByName,
  };
}
