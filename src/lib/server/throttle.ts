/**
 * Sign-in throttling: counts failed attempts per key in a sliding window and refuses further
 * attempts once a key reaches its limit, until the oldest failure leaves the window.
 * In memory on purpose: one server process per data folder, and a restart forgetting the
 * counters is acceptable for a brute-force brake.
 */
export class FailureThrottle {
  private readonly failures = new Map<string, number[]>();

  constructor(
    private readonly limit: number,
    private readonly windowMs: number,
    private readonly now: () => number = Date.now,
  ) {}

  /** Milliseconds until `key` may try again; 0 when it may try now. */
  retryAfterMs(key: string): number {
    const recent = this.prune(key);
    if (recent.length < this.limit) return 0;
    return recent[recent.length - this.limit]! + this.windowMs - this.now();
  }

  recordFailure(key: string): void {
    const recent = this.prune(key);
    recent.push(this.now());
    this.failures.set(key, recent);
  }

  reset(key: string): void {
    this.failures.delete(key);
  }

  private prune(key: string): number[] {
    const since = this.now() - this.windowMs;
    const recent = (this.failures.get(key) ?? []).filter((t) => t > since);
    if (recent.length === 0) this.failures.delete(key);
    else this.failures.set(key, recent);
    return recent;
  }
}

export interface SignInThrottle {
  account: FailureThrottle;
  address: FailureThrottle;
}

/** 5 failures per account or 20 per address within 15 minutes. */
export function createSignInThrottle(now?: () => number): SignInThrottle {
  const windowMs = 15 * 60 * 1000;
  return { account: new FailureThrottle(5, windowMs, now), address: new FailureThrottle(20, windowMs, now) };
}
