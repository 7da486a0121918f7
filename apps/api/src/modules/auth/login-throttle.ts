// Progressive delay per account: no lock-out that a stranger could trigger. After a few failed
// sign-ins on one account, every further attempt on it waits a little longer (doubling up to a
// ceiling) before it is checked; the right password still signs in, only later. Attempts queue, so
// parallel guesses gain little, yet none waits longer than the ceiling, so a flood of guesses cannot
// keep the owner out either. Refusals (429) come from the per-address limit only.

export interface ThrottleOptions {
  /** Failed attempts on an account before the delay starts. */
  freeFailures: number;
  /** First delay; each further failure doubles it. */
  baseDelayMs: number;
  maxDelayMs: number;
  /** Failures older than this are forgotten. */
  windowMs: number;
  /** Accounts tracked at most (the oldest are forgotten first), so guessing many names cannot fill memory. */
  maxKeys?: number;
  now?: () => number;
  sleep?: (ms: number) => Promise<void>;
}

interface Entry {
  failures: number;
  lastFailureAt: number;
  /** Attempts on this account start no earlier than this. */
  nextAt: number;
}

export class LoginThrottle {
  private readonly entries = new Map<string, Entry>();
  private readonly now: () => number;
  private readonly sleep: (ms: number) => Promise<void>;

  constructor(private readonly opts: ThrottleOptions) {
    this.now = opts.now ?? Date.now;
    this.sleep = opts.sleep ?? ((ms) => new Promise((resolve) => setTimeout(resolve, ms)));
  }

  /** The delay that follows the given number of failures. */
  delayAfter(failures: number): number {
    const over = failures - this.opts.freeFailures;
    if (over <= 0) return 0;
    return Math.min(this.opts.maxDelayMs, this.opts.baseDelayMs * 2 ** Math.min(over - 1, 30));
  }

  private entry(key: string): Entry | undefined {
    const e = this.entries.get(key);
    if (e && this.now() - e.lastFailureAt > this.opts.windowMs) {
      this.entries.delete(key);
      return undefined;
    }
    return e;
  }

  /** Waits for this account's turn; returns how long it waited (ms). */
  async wait(key: string): Promise<number> {
    const e = this.entry(key);
    if (!e) return 0;
    const start = this.now();
    const wait = Math.min(this.opts.maxDelayMs, Math.max(0, e.nextAt - start));
    // The next attempt queues behind this one, but no attempt waits longer than the ceiling: an
    // unbounded queue would let a flood of guesses keep the owner out.
    e.nextAt = Math.min(start + this.opts.maxDelayMs, Math.max(e.nextAt, start) + this.delayAfter(e.failures));
    if (wait > 0) await this.sleep(wait);
    return wait;
  }

  failed(key: string): void {
    const now = this.now();
    const e = this.entry(key) ?? { failures: 0, lastFailureAt: now, nextAt: now };
    e.failures += 1;
    e.lastFailureAt = now;
    e.nextAt = Math.max(e.nextAt, now + this.delayAfter(e.failures));
    this.entries.delete(key);
    this.entries.set(key, e);
    const max = this.opts.maxKeys ?? 10_000;
    while (this.entries.size > max) this.entries.delete(this.entries.keys().next().value as string);
  }

  succeeded(key: string): void {
    this.entries.delete(key);
  }

  failures(key: string): number {
    return this.entry(key)?.failures ?? 0;
  }
}
