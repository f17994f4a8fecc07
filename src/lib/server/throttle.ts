import { isIPv4, isIPv6 } from 'node:net';
import { and, count, desc, eq, gt, lt, or, sql } from 'drizzle-orm';
import type { Db } from '../../db/client';
import { signInFailures } from '../../db/schema';

/**
 * The sign-in policy (README, "Sign-in protection"). Brute force is braked without handing anyone a way to
 * lock another person out:
 * - one address may fail 5 times on one account in 15 minutes; then that address, and only it, waits for that
 *   account — the owner signing in from anywhere else is not affected;
 * - one address may fail 20 times in 15 minutes over all accounts (spraying one password over many);
 * - an account failed more than 10 times in 15 minutes from all addresses together is slowed, never closed:
 *   every attempt on it waits 1 s, doubling each further 5 failures up to 10 s, the right password included.
 * The counts live in the database, so they hold across every server process sharing it.
 */
export const SIGN_IN_POLICY = {
  windowMs: 15 * 60_000,
  perAccountAndAddress: 5,
  perAddress: 20,
  slowAfter: 10,
  firstDelayMs: 1_000,
  delayDoublesEvery: 5,
  maxDelayMs: 10_000,
} as const;

export type SignInPolicy = typeof SIGN_IN_POLICY;

/**
 * The key an address is counted under: IPv4 as it is (an IPv4-mapped IPv6 address as its IPv4 form), IPv6 by its
 * /64 prefix, since one host is routinely given a whole /64 and could otherwise step through it.
 *
 * @example addressKey('::ffff:192.0.2.7') // '192.0.2.7'
 * @example addressKey('2001:db8:1:2:aaaa::1') // '2001:db8:1:2::/64'
 */
export function addressKey(address: string): string {
  const mapped = /^::ffff:(\d+\.\d+\.\d+\.\d+)$/i.exec(address);
  if (mapped && isIPv4(mapped[1]!)) return mapped[1]!;
  if (!isIPv6(address)) return address;
  const [head = '', tail = ''] = address.toLowerCase().split('::');
  const left = head ? head.split(':') : [];
  const right = tail ? tail.split(':') : [];
  const groups = address.includes('::') ? [...left, ...Array<string>(8 - left.length - right.length).fill('0'), ...right] : left;
  return `${groups.slice(0, 4).map((g) => g.replace(/^0+(?=.)/, '')).join(':')}::/64`;
}

/** The wait before an attempt on an account failed `accountFailures` times in the window (0 below the threshold). */
export function slowDownMs(accountFailures: number, policy: SignInPolicy = SIGN_IN_POLICY): number {
  if (accountFailures < policy.slowAfter) return 0;
  const doublings = Math.floor((accountFailures - policy.slowAfter) / policy.delayDoublesEvery);
  return Math.min(policy.maxDelayMs, policy.firstDelayMs * 2 ** doublings);
}

export interface SignInVerdict {
  /** Milliseconds until this address may try this account again; 0 when it may try now. */
  refuseForMs: number;
  /** Milliseconds to wait before checking the password (the account-wide slow-down). */
  delayMs: number;
}

/** When the `limit`-th most recent failure matching `where` leaves the window, in ms from `now`. */
async function untilBelow(db: Db, where: ReturnType<typeof and>, limit: number, now: Date, policy: SignInPolicy): Promise<number> {
  const [edge] = await db.select({ at: signInFailures.failedAt }).from(signInFailures).where(where).orderBy(desc(signInFailures.failedAt)).offset(limit - 1).limit(1);
  return edge ? Math.max(1, edge.at.getTime() + policy.windowMs - now.getTime()) : 0;
}

/** What the policy says of an attempt on `accountKey` from `address` (already an addressKey) at `now`. */
export async function signInVerdict(db: Db, accountKey: string, address: string, now = new Date(), policy: SignInPolicy = SIGN_IN_POLICY): Promise<SignInVerdict> {
  const since = new Date(now.getTime() - policy.windowMs);
  const recent = gt(signInFailures.failedAt, since);
  const [counts] = await db
    .select({
      pair: sql<number>`count(*) filter (where ${signInFailures.accountKey} = ${accountKey} and ${signInFailures.address} = ${address})`.mapWith(Number),
      address: sql<number>`count(*) filter (where ${signInFailures.address} = ${address})`.mapWith(Number),
      account: sql<number>`count(*) filter (where ${signInFailures.accountKey} = ${accountKey})`.mapWith(Number),
    })
    .from(signInFailures)
    .where(and(recent, or(eq(signInFailures.accountKey, accountKey), eq(signInFailures.address, address))));
  const { pair = 0, address: fromAddress = 0, account = 0 } = counts ?? {};
  let refuseForMs = 0;
  if (pair >= policy.perAccountAndAddress) {
    refuseForMs = await untilBelow(db, and(recent, eq(signInFailures.accountKey, accountKey), eq(signInFailures.address, address)), policy.perAccountAndAddress, now, policy);
  }
  if (fromAddress >= policy.perAddress) {
    refuseForMs = Math.max(refuseForMs, await untilBelow(db, and(recent, eq(signInFailures.address, address)), policy.perAddress, now, policy));
  }
  return { refuseForMs, delayMs: slowDownMs(account, policy) };
}

/** Counts one failed attempt, and forgets failures that have left the window (of every account). */
export async function recordSignInFailure(db: Db, accountKey: string, address: string, now = new Date(), policy: SignInPolicy = SIGN_IN_POLICY): Promise<void> {
  await db.insert(signInFailures).values({ accountKey, address, failedAt: now });
  await db.delete(signInFailures).where(lt(signInFailures.failedAt, new Date(now.getTime() - policy.windowMs)));
}

/** A successful sign-in clears its own address's failures on the account (not those of other addresses). */
export async function clearSignInFailures(db: Db, accountKey: string, address: string): Promise<void> {
  await db.delete(signInFailures).where(and(eq(signInFailures.accountKey, accountKey), eq(signInFailures.address, address)));
}

/** Failures counted now (for the tests and the README's figures). */
export async function countSignInFailures(db: Db): Promise<number> {
  const [row] = await db.select({ n: count() }).from(signInFailures);
  return row?.n ?? 0;
}
