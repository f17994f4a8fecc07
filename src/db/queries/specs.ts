import { desc, eq } from 'drizzle-orm';
import type { Db } from '../client';
import { specs, users } from '../schema';

export interface SpecSummary {
  id: string;
  name: string;
  customer: string;
  ownerName: string;
  requirements: Record<string, unknown>;
  version: number;
  updatedAt: Date;
}

/** Requirement sets, most recently updated first, with the owner's display name. */
export async function listSpecSummaries(db: Db, limit = 200): Promise<SpecSummary[]> {
  return db
    .select({
      id: specs.id,
      name: specs.name,
      customer: specs.customer,
      ownerName: users.displayName,
      requirements: specs.requirements,
      version: specs.version,
      updatedAt: specs.updatedAt,
    })
    .from(specs)
    .innerJoin(users, eq(users.id, specs.ownerId))
    .orderBy(desc(specs.updatedAt))
    .limit(limit);
}
