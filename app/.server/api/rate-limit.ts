/**
 * Per-token request budget: a token bucket per token, per app process (kept in memory; with several
 * processes each has its own bucket). Capacity = API_RATE_LIMIT_PER_MINUTE, refilled continuously at that
 * rate, so a token may burst up to a minute's budget and then proceeds at the steady rate.
 */
export class RateLimiter {
  private readonly buckets = new Map<string, { tokens: number; at: number }>();
  constructor(private readonly perMinute: number) {}

  /** Takes one request from the key's budget: null when allowed, else the seconds to wait. */
  take(key: string, now = Date.now()): number | null {
    const rate = this.perMinute / 60_000; // per ms
    const bucket = this.buckets.get(key) ?? { tokens: this.perMinute, at: now };
    bucket.tokens = Math.min(
      this.perMinute,
      bucket.tokens + (now - bucket.at) * rate,
    );
    bucket.at = now;
    this.buckets.set(key, bucket);
    if (bucket.tokens >= 1) {
      bucket.tokens -= 1;
      return null;
    }
    return Math.max(1, Math.ceil((1 - bucket.tokens) / rate / 1000));
  }
}
