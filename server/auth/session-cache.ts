import type { SignedInUser } from './passport';

/** What the session lookup found: the user, and when the session expires (ms since the epoch). */
export interface OpenSession {
  user: SignedInUser;
  expiresAt: number;
}

interface Entry {
  /** The lookup in flight or done; requests for the same session while it runs share it. */
  answer: Promise<OpenSession | null>;
  /** Until when a found session may be answered from here (ms since the epoch); 0 while the lookup runs. */
  until: number;
}

/**
 * Remembers for a few seconds that a session is open, so that a burst of API requests with the same access token
 * asks PostgreSQL once instead of once per request. Only open sessions are kept, never a refusal.
 *
 * Ending sessions in this process (sign-out, password change or reset, a replayed refresh cookie) forgets them here
 * at once, so this process refuses their tokens from the next request on. Another server process on the same
 * database keeps answering from its own copy for at most `ttlMs` (SESSION_CACHE_SECONDS) after the session ended.
 * A lookup that was already running when its session was forgotten is not kept, since it may have read the row
 * before the session ended.
 */
export class SessionCache {
  private readonly entries = new Map<string, Entry>();

  constructor(
    private readonly ttlMs: number,
    private readonly lookup: (sessionId: string, userId: number) => Promise<OpenSession | null>,
    /** Most sessions kept; past it the oldest entry goes first. */
    private readonly maxEntries = 10_000,
  ) {}

  async find(sessionId: string, userId: number): Promise<SignedInUser | null> {
    if (this.ttlMs <= 0) return (await this.lookup(sessionId, userId))?.user ?? null;
    const key = `${sessionId}:${userId}`;
    const now = Date.now();
    let entry = this.entries.get(key);
    if (entry && entry.until !== 0 && entry.until <= now) {
      this.entries.delete(key);
      entry = undefined;
    }
    if (!entry) entry = this.start(key, sessionId, userId);
    return (await entry.answer)?.user ?? null;
  }

  /** Forgets one session (it has ended). */
  forget(sessionId: string): void {
    for (const key of this.entries.keys()) if (key.startsWith(`${sessionId}:`)) this.entries.delete(key);
  }

  /** Forgets every session of an account (its password changed or was reset). */
  forgetUser(userId: number): void {
    for (const key of this.entries.keys()) if (key.endsWith(`:${userId}`)) this.entries.delete(key);
  }

  private start(key: string, sessionId: string, userId: number): Entry {
    const entry: Entry = { answer: this.lookup(sessionId, userId), until: 0 };
    if (this.entries.size >= this.maxEntries) this.entries.delete(this.entries.keys().next().value!);
    this.entries.set(key, entry);
    entry.answer.then(
      (found) => {
        // Forgotten meanwhile (the map holds another entry or none): this answer is not kept.
        if (this.entries.get(key) !== entry) return;
        if (found) entry.until = Math.min(Date.now() + this.ttlMs, found.expiresAt);
        else this.entries.delete(key);
      },
      () => {
        if (this.entries.get(key) === entry) this.entries.delete(key);
      },
    );
    return entry;
  }
}
