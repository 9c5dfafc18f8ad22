/**
 * A token bucket for one socket's requests: up to `burst` at once, refilled at `perSecond`. Enough
 * for a screen that asks for a snapshot after a gap; a loop asking hundreds of times is cut short.
 */
export class RequestBudget {
  private tokens: number;
  private refilledAt: number;

  constructor(
    private readonly perSecond = 2,
    private readonly burst = 5,
    private readonly now: () => number = Date.now,
  ) {
    this.tokens = burst;
    this.refilledAt = now();
  }

  take(): boolean {
    const now = this.now();
    this.tokens = Math.min(this.burst, this.tokens + ((now - this.refilledAt) / 1000) * this.perSecond);
    this.refilledAt = now;
    if (this.tokens < 1) return false;
    this.tokens -= 1;
    return true;
  }
}
