/**
 * Per-client token buckets held in memory (one process), for endpoints that do real work per
 * request, such as the stateless check API. A bucket holds up to `capacity` tokens and refills
 * at `refillPerSecond`; each request takes one. Memory is bounded by `maxClients`: full buckets
 * carry no information and are dropped first, then the least recently seen client.
 */

export interface RateLimitOptions {
  capacity: number;
  refillPerSecond: number;
  /** Most clients remembered at once. */
  maxClients?: number;
  /** Milliseconds clock (injectable for tests). */
  now?: () => number;
}

export type RateDecision =
  | { allowed: true; remaining: number }
  | { allowed: false; remaining: 0; retryAfterSeconds: number };

interface Bucket {
  tokens: number;
  at: number;
}

export class TokenBucketLimiter {
  readonly capacity: number;
  readonly refillPerSecond: number;
  readonly maxClients: number;
  private readonly now: () => number;
  // A Map iterates in insertion order; re-inserting on each hit keeps it least-recent first.
  private readonly buckets = new Map<string, Bucket>();

  constructor(options: RateLimitOptions) {
    if (!(options.capacity >= 1)) throw new RangeError(`capacity must be at least 1, got ${options.capacity}`);
    if (!(options.refillPerSecond > 0)) {
      throw new RangeError(`refillPerSecond must be positive, got ${options.refillPerSecond}`);
    }
    const maxClients = options.maxClients ?? 10_000;
    if (!(maxClients >= 1)) throw new RangeError(`maxClients must be at least 1, got ${maxClients}`);
    this.capacity = options.capacity;
    this.refillPerSecond = options.refillPerSecond;
    this.maxClients = maxClients;
    this.now = options.now ?? (() => Date.now());
  }

  /** Takes one token for `key` if it has one. */
  take(key: string): RateDecision {
    const now = this.now();
    const bucket = this.refilled(key, now);
    this.buckets.delete(key);
    if (bucket.tokens >= 1) {
      bucket.tokens -= 1;
      this.store(key, bucket);
      return { allowed: true, remaining: Math.floor(bucket.tokens) };
    }
    this.store(key, bucket);
    const waitSeconds = (1 - bucket.tokens) / this.refillPerSecond;
    return { allowed: false, remaining: 0, retryAfterSeconds: Math.max(1, Math.ceil(waitSeconds)) };
  }

  /** How many clients are remembered now. */
  size(): number {
    return this.buckets.size;
  }

  private refilled(key: string, now: number): Bucket {
    const b = this.buckets.get(key);
    if (!b) return { tokens: this.capacity, at: now };
    // A clock that goes backwards must not mint tokens.
    const elapsed = Math.max(0, now - b.at) / 1000;
    return { tokens: Math.min(this.capacity, b.tokens + elapsed * this.refillPerSecond), at: Math.max(now, b.at) };
  }

  private store(key: string, bucket: Bucket): void {
    if (this.buckets.size >= this.maxClients) this.evict(bucket.at);
    this.buckets.set(key, bucket);
  }

  private evict(now: number): void {
    for (const [k, b] of this.buckets) {
      const tokens = b.tokens + (Math.max(0, now - b.at) / 1000) * this.refillPerSecond;
      if (tokens >= this.capacity) this.buckets.delete(k);
    }
    while (this.buckets.size >= this.maxClients) {
      const oldest = this.buckets.keys().next();
      if (oldest.done) break;
      this.buckets.delete(oldest.value);
    }
  }
}

/**
 * The client's address: the last entry of X-Forwarded-For, which is the one the nearest
 * reverse proxy appended (entries to its left come from the client and can be forged), else
 * X-Real-IP, else the socket address the caller passes, else "unknown". Keys are trimmed and
 * capped so a forged header cannot grow memory per entry.
 */
export function clientKey(headers: Headers, remoteAddress?: string | null): string {
  const forwarded = headers.get("x-forwarded-for")?.split(",").at(-1)?.trim();
  const candidate = forwarded || headers.get("x-real-ip")?.trim() || remoteAddress?.trim() || "unknown";
  return candidate.slice(0, 64);
}
