import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { tallyBallots, type TallyBallot } from '../../src/features/shortlists/tally';

const repeat = (count: number, ranking: string[]): TallyBallot[] => Array.from({ length: count }, (_, i) => ({ voterName: `v${i}`, ranking, concerns: [] }));

describe('Borda count', () => {
  // Worked example "Tennessee's capital" (100 voters: Memphis 42, Nashville 26, Chattanooga 15,
  // Knoxville 17) from the Borda count article of the English Wikipedia — from memory.
  it('reproduces the Tennessee capital worked example: Nashville 194, Chattanooga 173, Memphis 126, Knoxville 107', () => {
    const [M, N, C, K] = ['memphis', 'nashville', 'chattanooga', 'knoxville'];
    const ballots = [
      ...repeat(42, [M!, N!, C!, K!]),
      ...repeat(26, [N!, C!, K!, M!]),
      ...repeat(15, [C!, K!, N!, M!]),
      ...repeat(17, [K!, C!, N!, M!]),
    ];
    const tally = tallyBallots([M!, N!, C!, K!], ballots);
    expect(tally.ballots).toBe(100);
    expect(tally.candidates.map((c) => [c.candidateId, c.borda, c.firstPreferences])).toEqual([
      [N, 194, 26],
      [C, 173, 15],
      [M, 126, 42],
      [K, 107, 17],
    ]);
  });

  it('lists blocking concerns beside their candidate', () => {
    const tally = tallyBallots(['a', 'b'], [{ voterName: 'Priya', ranking: ['a', 'b'], concerns: [{ candidateId: 'b', reason: 'needs a 1200 V part' }] }]);
    expect(tally.candidates.find((c) => c.candidateId === 'b')?.concerns).toEqual([{ voterName: 'Priya', reason: 'needs a 1200 V part' }]);
  });

  it('points always add up to ballots · n(n−1)/2 and first preferences to the ballot count (derived)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 7 }), fc.array(fc.nat(), { maxLength: 60 }), (n, seeds) => {
        const ids = Array.from({ length: n }, (_, i) => `c${i}`);
        const ballots = seeds.map((seed, v) => {
          const ranking = [...ids].sort((a, b) => ((seed * 31 + a.charCodeAt(1)) % 7) - ((seed * 31 + b.charCodeAt(1)) % 7));
          return { voterName: `v${v}`, ranking, concerns: [] };
        });
        const tally = tallyBallots(ids, ballots);
        expect(tally.candidates.reduce((s, c) => s + c.borda, 0)).toBe((ballots.length * n * (n - 1)) / 2);
        expect(tally.candidates.reduce((s, c) => s + c.firstPreferences, 0)).toBe(ballots.length);
      }),
    );
  });
});
