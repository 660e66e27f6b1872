/**
 * Slows sign-in down for an account that keeps failing, instead of locking it. A lock-out keyed
 * by account alone lets anyone shut a coach out by typing wrong passwords from anywhere; a delay
 * keeps guessing expensive while the right password still gets in (OWASP Authentication Cheat
 * Sheet, "Account lockout": prefer throttling that cannot be turned into a denial of service).
 */

/** Failures remembered per account for this long, ms (the same window as the address limits). */
export const SLOWDOWN_WINDOW_MS = 15 * 60 * 1000;

interface Failures {
  count: number;
  firstAt: number;
}

/** In-memory failure counts per account (one server process; a restart forgets them, which only speeds things up). */
export class LoginSlowdown {
  private readonly failures = new Map<string, Failures>();

  /**
   * `freeFailures`: failures in the window before any delay; `baseDelayMs` doubles with each further
   * failure up to `maxDelayMs`.
   */
  constructor(
    private readonly freeFailures: number,
    private readonly baseDelayMs: number,
    private readonly maxDelayMs: number,
  ) {}

  /** The delay the next attempt for this account waits, ms (0 while under the free failures). */
  delayFor(account: string, now = Date.now()): number {
    const f = this.current(account, now);
    if (!f || f.count < this.freeFailures) return 0;
    return Math.min(this.maxDelayMs, this.baseDelayMs * 2 ** (f.count - this.freeFailures));
  }

  /** Waits out the account's delay. */
  async wait(account: string): Promise<void> {
    const ms = this.delayFor(account);
    if (ms > 0) await new Promise((resolve) => setTimeout(resolve, ms));
  }

  /** Counts a failed attempt. */
  fail(account: string, now = Date.now()): void {
    const f = this.current(account, now);
    if (f) f.count++;
    else this.failures.set(account, { count: 1, firstAt: now });
    if (this.failures.size > 10_000) this.prune(now);
  }

  /** Forgets the account's failures (a successful sign-in). */
  clear(account: string): void {
    this.failures.delete(account);
  }

  private current(account: string, now: number): Failures | undefined {
    const f = this.failures.get(account);
    if (f && now - f.firstAt > SLOWDOWN_WINDOW_MS) {
      this.failures.delete(account);
      return undefined;
    }
    return f;
  }

  private prune(now: number): void {
    for (const [key, f] of this.failures) if (now - f.firstAt > SLOWDOWN_WINDOW_MS) this.failures.delete(key);
  }
}
