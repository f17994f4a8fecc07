import { describe, expect, it } from 'vitest';
import { addressKey, SIGN_IN_POLICY, slowDownMs } from '../../src/lib/server/throttle';

/** The sign-in policy's pure parts; the counting itself runs on both databases in tests/db/throttle.test.ts. */
describe('sign-in throttle: address keys', () => {
  it.each([
    ['192.0.2.7', '192.0.2.7'],
    ['::ffff:192.0.2.7', '192.0.2.7'],
    ['2001:db8:1:2:aaaa:bbbb:cccc:dddd', '2001:db8:1:2::/64'],
    ['2001:0db8:0001:0002::1', '2001:db8:1:2::/64'],
    ['2001:db8::1', '2001:db8:0:0::/64'],
    ['::1', '0:0:0:0::/64'],
  ])('%s counts as %s', (address, key) => {
    expect(addressKey(address)).toBe(key);
  });

  it('two addresses of one /64 count together, of two /64s apart', () => {
    expect(addressKey('2001:db8:1:2::a')).toBe(addressKey('2001:db8:1:2:ffff::b'));
    expect(addressKey('2001:db8:1:2::a')).not.toBe(addressKey('2001:db8:1:3::a'));
  });
});

describe('sign-in throttle: the account-wide slow-down', () => {
  it.each([
    [0, 0], [9, 0], [10, 1_000], [14, 1_000], [15, 2_000], [20, 4_000], [25, 8_000], [30, 10_000], [500, 10_000],
  ])('%i failures in the window: wait %i ms', (failures, ms) => {
    expect(slowDownMs(failures)).toBe(ms);
  });

  it('never refuses: the wait stays bounded however many failures pile up', () => {
    expect(slowDownMs(Number.MAX_SAFE_INTEGER)).toBe(SIGN_IN_POLICY.maxDelayMs);
  });
});
