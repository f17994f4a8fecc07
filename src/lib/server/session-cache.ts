import type { SignedInUser } from './auth';

interface Entry {
  user: SignedInUser;
  expiresAt: Date;
  /** When the database last confirmed this session (ms since the epoch). */
  checkedAtMs: number;
}

export interface SessionCacheOptions {
  /** The sliding session lifetime; lucia renews a session used in its second half. */
  lifetimeMs: number;
  /**
   * How long a confirmed session may be trusted without asking the database again. `null` when
   * this process is the only writer of sessions and members (embedded database): entries then
   * stay until evicted or until the renewal point. With a shared PostgreSQL server a change made
   * by another process is seen after at most this long.
   */
  maxAgeMs: number | null;
  /** Upper bound on entries; the oldest confirmed sessions are dropped first. */
  maxEntries: number;
}

/**
 * A per-process cache of validated sessions, keyed by the stored session id (the SHA-256 of the
 * cookie token, never the token). A hit answers exactly what the database would: it is only
 * trusted before the renewal point (`expiresAt − lifetime/2`), after which lucia must extend the
 * session in the database anyway. Every sign-out, session deletion and member change evicts the
 * entries it affects; a lookup that was running while an eviction happened is not stored (the
 * `generation` check), so a session ended mid-request is never cached afterwards.
 */
export class SessionCache {
  readonly #entries = new Map<string, Entry>();
  #generation = 0;

  constructor(private readonly options: SessionCacheOptions) {}

  /** The cached user when the entry is still trustworthy at `nowMs`, else undefined. */
  get(sessionId: string, nowMs = Date.now()): { user: SignedInUser; expiresAt: Date } | undefined {
    const entry = this.#entries.get(sessionId);
    if (!entry) return undefined;
    const renewFromMs = entry.expiresAt.getTime() - this.options.lifetimeMs / 2;
    const stale = this.options.maxAgeMs !== null && nowMs - entry.checkedAtMs >= this.options.maxAgeMs;
    if (nowMs >= renewFromMs || stale) {
      this.#entries.delete(sessionId);
      return undefined;
    }
    return { user: entry.user, expiresAt: entry.expiresAt };
  }

  /** Call before asking the database; pass the result to `put`. */
  generation(): number {
    return this.#generation;
  }

  /** Stores what the database just confirmed, unless anything was evicted since `generation`. */
  put(sessionId: string, user: SignedInUser, expiresAt: Date, generation: number, nowMs = Date.now()): void {
    if (generation !== this.#generation || !user.active) return;
    if (this.#entries.size >= this.options.maxEntries) {
      const oldest = this.#entries.keys().next().value;
      if (oldest !== undefined) this.#entries.delete(oldest);
    }
    this.#entries.delete(sessionId); // re-insert so Map order stays oldest-confirmed first
    this.#entries.set(sessionId, { user: Object.freeze({ ...user }), expiresAt, checkedAtMs: nowMs });
  }

  forgetSession(sessionId: string): void {
    this.#generation++;
    this.#entries.delete(sessionId);
  }

  /** After a role change, deactivation or sign-out everywhere of one member. */
  forgetUser(userId: string): void {
    this.#generation++;
    for (const [id, entry] of this.#entries) if (entry.user.id === userId) this.#entries.delete(id);
  }

  forgetAll(): void {
    this.#generation++;
    this.#entries.clear();
  }

  get size(): number {
    return this.#entries.size;
  }
}
