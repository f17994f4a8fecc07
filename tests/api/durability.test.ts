import { describe, expect, it } from 'vitest';
import { runDurability } from '../../scripts/durability';

// The embedded database only: PostgreSQL mode keeps its data in the server, not in the killed process.
describe.skipIf(process.env.RESETWISE_TEST_DB === 'postgres')('crash durability of the embedded database', () => {
  it('every write acknowledged before a SIGKILL is there after the restart', async () => {
    const report = await runDurability(1);
    console.log(`Durability: acknowledged ${report.acknowledged.specSaves} spec saves, ${report.acknowledged.ballots} ballots, ${report.acknowledged.members} members; ${report.unacknowledged} cut off`);
    expect(report.acknowledged.ballots).toBeGreaterThan(0);
    expect(report.acknowledged.specSaves).toBeGreaterThan(0);
    expect(report.problems).toEqual([]);
  }, 180_000);

  // Issue 16: a graceful stop finishes the requests in flight, closes the database and exits 0.
  it('every write acknowledged before a SIGTERM is there after the restart, and the stop exits 0', async () => {
    const report = await runDurability(1, 'SIGTERM');
    console.log(`Durability (SIGTERM): acknowledged ${report.acknowledged.specSaves} spec saves, ${report.acknowledged.ballots} ballots, ${report.acknowledged.members} members; ${report.unacknowledged} cut off`);
    expect(report.acknowledged.ballots).toBeGreaterThan(0);
    expect(report.problems).toEqual([]);
  }, 180_000);
});
