import { describe, expect, it } from 'vitest';
import { createSignInThrottle, FailureThrottle } from '../../src/lib/server/throttle';

describe('FailureThrottle', () => {
  it('allows attempts until the limit, then asks to wait until the oldest failure leaves the window', () => {
    let now = 0;
    const throttle = new FailureThrottle(3, 60_000, () => now);
    for (let i = 0; i < 3; i++) {
      expect(throttle.retryAfterMs('a')).toBe(0);
      throttle.recordFailure('a');
      now += 1_000;
    }
    // failures at 0, 1000, 2000; now = 3000 → the first expires at 60000
    expect(throttle.retryAfterMs('a')).toBe(57_000);
    expect(throttle.retryAfterMs('b')).toBe(0);
    now = 60_001;
    expect(throttle.retryAfterMs('a')).toBe(0);
  });

  it('reset clears a key', () => {
    const throttle = new FailureThrottle(1, 60_000, () => 0);
    throttle.recordFailure('a');
    expect(throttle.retryAfterMs('a')).toBeGreaterThan(0);
    throttle.reset('a');
    expect(throttle.retryAfterMs('a')).toBe(0);
  });

  it('sign-in throttle: 5 per account, 20 per address in 15 minutes', () => {
    const throttle = createSignInThrottle(() => 1_000_000);
    for (let i = 0; i < 5; i++) throttle.account.recordFailure('x@example.com');
    expect(throttle.account.retryAfterMs('x@example.com')).toBe(15 * 60 * 1000);
    for (let i = 0; i < 19; i++) throttle.address.recordFailure('127.0.0.1');
    expect(throttle.address.retryAfterMs('127.0.0.1')).toBe(0);
    throttle.address.recordFailure('127.0.0.1');
    expect(throttle.address.retryAfterMs('127.0.0.1')).toBeGreaterThan(0);
  });
});
