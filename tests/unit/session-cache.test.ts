import { describe, expect, it } from 'vitest';
import { SessionCache } from '../../src/lib/server/session-cache';
import type { SignedInUser } from '../../src/lib/server/auth';

// The per-process session cache (issue #8). A hit must give the answer lucia would give from the
// database: only before the renewal point (expiry − lifetime/2; lucia's sliding expiry), never
// after an eviction, never for a deactivated member. Values below are derived from those rules.

const HOUR = 3_600_000;
const lifetimeMs = 12 * HOUR;
const engineer: SignedInUser = { id: 'u1', email: 'e@halvard.example', displayName: 'E', role: 'engineer', active: true };
const sales: SignedInUser = { id: 'u2', email: 's@halvard.example', displayName: 'S', role: 'sales', active: true };
const t0 = Date.UTC(2026, 11, 2, 9, 0, 0);

function cache(maxAgeMs: number | null = null, maxEntries = 100): SessionCache {
  return new SessionCache({ lifetimeMs, maxAgeMs, maxEntries });
}

describe('SessionCache', () => {
  it('answers until the renewal point, then leaves the renewal to the database', () => {
    const c = cache();
    c.put('s1', engineer, new Date(t0 + 12 * HOUR), c.generation(), t0);
    expect(c.get('s1', t0 + 5 * HOUR)?.user).toEqual(engineer);
    expect(c.get('s1', t0 + 6 * HOUR - 1)?.user.role).toBe('engineer');
    expect(c.get('s1', t0 + 6 * HOUR)).toBeUndefined(); // second half of the life: lucia must extend it
    expect(c.size).toBe(0);
  });

  it('never answers for an expired session', () => {
    const c = cache();
    c.put('s1', engineer, new Date(t0 + HOUR), c.generation(), t0); // already in its second half
    expect(c.get('s1', t0)).toBeUndefined();
    c.put('s2', engineer, new Date(t0 + 12 * HOUR), c.generation(), t0);
    expect(c.get('s2', t0 + 13 * HOUR)).toBeUndefined();
  });

  it('sign-out evicts that session only; a member change evicts all of that member and nobody else', () => {
    const c = cache();
    const exp = new Date(t0 + 12 * HOUR);
    c.put('a', engineer, exp, c.generation(), t0);
    c.put('b', engineer, exp, c.generation(), t0);
    c.put('c', sales, exp, c.generation(), t0);
    c.forgetSession('a');
    expect(c.get('a', t0)).toBeUndefined();
    expect(c.get('b', t0)).toBeDefined();
    c.forgetUser('u1');
    expect(c.get('b', t0)).toBeUndefined();
    expect(c.get('c', t0)?.user.id).toBe('u2');
    c.forgetAll();
    expect(c.size).toBe(0);
  });

  it('a lookup that overlapped an eviction is not stored (a session ended mid-request stays ended)', () => {
    const c = cache();
    const before = c.generation();
    c.forgetSession('s1'); // sign-out lands while the database lookup for s1 is running
    c.put('s1', engineer, new Date(t0 + 12 * HOUR), before, t0);
    expect(c.get('s1', t0)).toBeUndefined();
    c.put('s1', engineer, new Date(t0 + 12 * HOUR), c.generation(), t0);
    expect(c.get('s1', t0)).toBeDefined();
  });

  it('does not store a deactivated member, and hands out a copy that cannot be changed', () => {
    const c = cache();
    c.put('s1', { ...engineer, active: false }, new Date(t0 + 12 * HOUR), c.generation(), t0);
    expect(c.get('s1', t0)).toBeUndefined();
    const user = { ...engineer };
    c.put('s2', user, new Date(t0 + 12 * HOUR), c.generation(), t0);
    user.role = 'admin';
    const hit = c.get('s2', t0)!;
    expect(hit.user.role).toBe('engineer');
    expect(Object.isFrozen(hit.user)).toBe(true);
  });

  it('with a shared database server, re-asks after maxAgeMs', () => {
    const c = cache(2_000);
    c.put('s1', engineer, new Date(t0 + 12 * HOUR), c.generation(), t0);
    expect(c.get('s1', t0 + 1_999)).toBeDefined();
    expect(c.get('s1', t0 + 2_000)).toBeUndefined();
  });

  it('keeps at most maxEntries, dropping the longest-confirmed first', () => {
    const c = cache(null, 2);
    const exp = new Date(t0 + 12 * HOUR);
    c.put('a', engineer, exp, c.generation(), t0);
    c.put('b', engineer, exp, c.generation(), t0);
    c.put('c', sales, exp, c.generation(), t0);
    expect(c.size).toBe(2);
    expect(c.get('a', t0)).toBeUndefined();
    expect(c.get('c', t0)).toBeDefined();
  });
});
