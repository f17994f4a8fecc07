import { inArray } from 'drizzle-orm';
import type { Db } from './client';
import { specs, users } from './schema';
import { recordAudit } from './queries/audit';
import { demoAccounts, DEMO_PASSWORD } from '../demo/accounts';
import { demoSpecs } from '../demo/specs';
import { seedLibraryIfEmpty } from './queries/parts';
import { SEED_SUMMARY, seedLibraryJson } from '../features/parts/seed-library';

export interface SeedReport {
  usersAdded: number;
  specsAdded: number;
}

const demoSpecId = (index: number): string => `demo-spec-${index + 1}`;

/**
 * Seeds the invented demo workspace. Idempotent: rows carry fixed ids and are inserted with
 * ON CONFLICT DO NOTHING, so a second run adds nothing and never overwrites a team's edits.
 */
export async function seedDemo(db: Db, hashPassword: (password: string) => Promise<string>): Promise<SeedReport> {
  const emails = demoAccounts.map((a) => a.email);
  const present = new Set(
    (await db.select({ email: users.email }).from(users).where(inArray(users.email, emails))).map((r) => r.email),
  );
  const missing = demoAccounts.filter((a) => !present.has(a.email));
  const passwordHash = missing.length > 0 ? await hashPassword(DEMO_PASSWORD) : '';
  return db.transaction(async (tx) => {
    let usersAdded = 0;
    for (const account of missing) {
      const added = await tx.insert(users).values({ ...account, passwordHash }).onConflictDoNothing().returning({ id: users.id });
      usersAdded += added.length;
    }
    const architect = demoAccounts.find((a) => a.role === 'architect');
    let specsAdded = 0;
    for (const [index, spec] of demoSpecs.entries()) {
      const added = await tx
        .insert(specs)
        .values({ id: demoSpecId(index), name: spec.name, customer: spec.customer, ownerId: architect!.id, requirements: spec.requirements })
        .onConflictDoNothing()
        .returning({ id: specs.id });
      specsAdded += added.length;
    }
    // Version 1 of the parts library: the engine's invented demo parts (a no-op once any version exists).
    await seedLibraryIfEmpty(tx, seedLibraryJson(), SEED_SUMMARY);
    if (usersAdded + specsAdded > 0) {
      await recordAudit(tx, { actorId: null, action: 'demo.seeded', entityType: 'workspace', details: { usersAdded, specsAdded } });
    }
    return { usersAdded, specsAdded };
  });
}
