import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { backends } from '../helpers/databases';
import type { Database } from '../../src/db/client';
import { clearSignInFailures, countSignInFailures, recordSignInFailure, SIGN_IN_POLICY, signInVerdict } from '../../src/lib/server/throttle';

// Issue 16: the sign-in throttle counts in the database, so every process sharing it sees the same counts, and
// no one can lock another person out (a per-account limit per address; an account-wide slow-down, never a wall).

const minutes = (n: number) => n * 60_000;
const at = (ms: number) => new Date(Date.UTC(2026, 11, 4, 9, 0, 0) + ms);

describe.each(backends())('sign-in throttle on $name', (backend) => {
  let database: Database;
  beforeAll(async () => {
    database = await backend.open();
  });
  afterAll(async () => {
    await database?.close();
  });

  it('five failures from one address close that account to that address only, until the fifth-newest leaves the window', async () => {
    const { db } = database;
    for (let i = 0; i < 5; i++) await recordSignInFailure(db, 'owner@x.example', '198.51.100.1', at(minutes(i)));
    const now = at(minutes(5));
    expect(await signInVerdict(db, 'owner@x.example', '198.51.100.1', now)).toEqual({ refuseForMs: minutes(10), delayMs: 0 });
    expect(await signInVerdict(db, 'owner@x.example', '198.51.100.2', now)).toEqual({ refuseForMs: 0, delayMs: 0 });
    expect(await signInVerdict(db, 'someone-else@x.example', '198.51.100.1', now)).toEqual({ refuseForMs: 0, delayMs: 0 });
    // 15 minutes after the first failure it has left the window: four remain, the address may try again.
    expect((await signInVerdict(db, 'owner@x.example', '198.51.100.1', at(minutes(15) + 1))).refuseForMs).toBe(0);
  });

  it('twenty failures from one address over many accounts close that address', async () => {
    const { db } = database;
    for (let i = 0; i < SIGN_IN_POLICY.perAddress; i++) await recordSignInFailure(db, `sprayed${i}@x.example`, '203.0.113.9', at(minutes(20) + i * 1000));
    const verdict = await signInVerdict(db, 'new-target@x.example', '203.0.113.9', at(minutes(21)));
    expect(verdict.refuseForMs).toBe(minutes(15) - minutes(1));
    expect((await signInVerdict(db, 'new-target@x.example', '203.0.113.10', at(minutes(21)))).refuseForMs).toBe(0);
  });

  it('an account attacked from many addresses is slowed for everyone, never closed', async () => {
    const { db } = database;
    for (let i = 0; i < 22; i++) await recordSignInFailure(db, 'target@x.example', `192.0.2.${i}`, at(minutes(40) + i * 1000));
    const verdict = await signInVerdict(db, 'target@x.example', '192.0.2.250', at(minutes(41)));
    expect(verdict).toEqual({ refuseForMs: 0, delayMs: 4_000 });
  });

  it('success clears its own address only; old rows are forgotten as new failures come', async () => {
    const { db } = database;
    await recordSignInFailure(db, 'clear@x.example', '198.51.100.50', at(minutes(60)));
    await recordSignInFailure(db, 'clear@x.example', '198.51.100.51', at(minutes(60)));
    await clearSignInFailures(db, 'clear@x.example', '198.51.100.50');
    const left = await signInVerdict(db, 'clear@x.example', '198.51.100.51', at(minutes(60)));
    expect(left.refuseForMs).toBe(0);
    // Two hours on, one failure more: everything older than the window is gone.
    await recordSignInFailure(db, 'late@x.example', '198.51.100.99', at(minutes(180)));
    expect(await countSignInFailures(db)).toBe(1);
  });
});
