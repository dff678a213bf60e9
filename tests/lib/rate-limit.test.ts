import { describe, expect, it } from "vitest";
import { clientKey, TokenBucketLimiter } from "@/lib/rate-limit";

function clock(start = 1_000_000) {
  let t = start;
  return { now: () => t, advance: (ms: number) => (t += ms) };
}

describe("TokenBucketLimiter", () => {
  it("allows a burst of `capacity` requests, then refuses with a Retry-After", () => {
    const c = clock();
    const l = new TokenBucketLimiter({ capacity: 3, refillPerSecond: 0.5, now: c.now });
    expect(l.take("a")).toEqual({ allowed: true, remaining: 2 });
    expect(l.take("a")).toEqual({ allowed: true, remaining: 1 });
    expect(l.take("a")).toEqual({ allowed: true, remaining: 0 });
    // One token takes 1 / 0.5 = 2 s to come back.
    expect(l.take("a")).toEqual({ allowed: false, remaining: 0, retryAfterSeconds: 2 });
  });

  it("refills at the given rate and never above capacity", () => {
    const c = clock();
    const l = new TokenBucketLimiter({ capacity: 2, refillPerSecond: 1, now: c.now });
    l.take("a");
    l.take("a");
    expect(l.take("a").allowed).toBe(false);
    c.advance(1000);
    expect(l.take("a")).toEqual({ allowed: true, remaining: 0 });
    c.advance(60_000);
    expect(l.take("a")).toEqual({ allowed: true, remaining: 1 });
  });

  it("keeps clients apart", () => {
    const c = clock();
    const l = new TokenBucketLimiter({ capacity: 1, refillPerSecond: 0.1, now: c.now });
    expect(l.take("a").allowed).toBe(true);
    expect(l.take("a").allowed).toBe(false);
    expect(l.take("b").allowed).toBe(true);
  });

  it("does not mint tokens when the clock goes backwards", () => {
    const c = clock();
    const l = new TokenBucketLimiter({ capacity: 1, refillPerSecond: 1, now: c.now });
    l.take("a");
    c.advance(-5000);
    expect(l.take("a").allowed).toBe(false);
  });

  it("stays within maxClients, dropping full buckets first and then the least recently seen", () => {
    const c = clock();
    const l = new TokenBucketLimiter({ capacity: 2, refillPerSecond: 1, maxClients: 3, now: c.now });
    l.take("a");
    l.take("a"); // a empty
    l.take("b");
    l.take("b"); // b empty
    l.take("c"); // c half
    c.advance(10); // none refilled yet
    l.take("d"); // full: evicts the least recent, a
    expect(l.size()).toBe(3);
    // a was forgotten, so it starts again with a full bucket; b is still remembered as empty.
    expect(l.take("b").allowed).toBe(false);
    c.advance(5000); // every bucket refills to full, so the next newcomer clears them all
    l.take("e");
    expect(l.size()).toBe(1);
    for (let i = 0; i < 1000; i++) l.take(`k${i}`);
    expect(l.size()).toBeLessThanOrEqual(3);
  });

  it("refuses nonsensical options with a sentence naming the option", () => {
    expect(() => new TokenBucketLimiter({ capacity: 0, refillPerSecond: 1 })).toThrow("capacity must be at least 1, got 0");
    expect(() => new TokenBucketLimiter({ capacity: 1, refillPerSecond: 0 })).toThrow(
      "refillPerSecond must be positive, got 0",
    );
    expect(() => new TokenBucketLimiter({ capacity: 1, refillPerSecond: 1, maxClients: 0 })).toThrow(
      "maxClients must be at least 1, got 0",
    );
  });
});

describe("clientKey", () => {
  it("takes the address the nearest proxy appended to X-Forwarded-For, not the forgeable ones before it", () => {
    expect(clientKey(new Headers({ "x-forwarded-for": " 203.0.113.9 , 198.51.100.7 " }))).toBe("198.51.100.7");
    expect(clientKey(new Headers({ "x-forwarded-for": "203.0.113.9" }))).toBe("203.0.113.9");
  });
  it("falls back to X-Real-IP, then the socket address, then 'unknown'", () => {
    expect(clientKey(new Headers({ "x-real-ip": "198.51.100.4" }), "127.0.0.1")).toBe("198.51.100.4");
    expect(clientKey(new Headers({ "x-forwarded-for": "" }), "127.0.0.1")).toBe("127.0.0.1");
    expect(clientKey(new Headers())).toBe("unknown");
  });
  it("caps a forged, very long header", () => {
    expect(clientKey(new Headers({ "x-forwarded-for": "x".repeat(5000) })).length).toBe(64);
  });
});
