import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { removeTempDir, setUpDatabase } from "./readers-db";

type Route = typeof import("@/app/api/v1/check/route");
let POST: Route["POST"];
let closeCheckPool: () => Promise<void>;

beforeAll(async () => {
  await setUpDatabase();
  ({ POST } = await import("@/app/api/v1/check/route"));
  ({ closeCheckPool } = await import("@/lib/check-pool"));
});

afterAll(async () => {
  await closeCheckPool();
  removeTempDir();
});

function post(body: BodyInit | null, ip: string, headers: Record<string, string> = {}): Promise<Response> {
  return POST(
    new Request("http://localhost/api/v1/check", {
      method: "POST",
      body,
      headers: { "content-type": "application/json", "x-forwarded-for": ip, ...headers },
      // Streams as request bodies need half duplex in Node's fetch.
      ...(body instanceof ReadableStream ? { duplex: "half" } : {}),
    } as RequestInit),
  );
}

const hawkDove = {
  format: "restpoint/model@1",
  title: "Gull contest over a fish",
  parameters: { V: 2, C: 4 },
  game: { kind: "symmetric", strategies: ["Grab", "Yield"], payoffs: [["(V - C) / 2", "V"], [0, "V / 2"]] },
  experiments: [{ id: "run-1", initial: [0.1, 0.9], duration: 20, samples: 11 }],
  // Interior rest point at Grab share V/C (Maynard Smith 1982, from memory).
  claims: [{ id: "mixed", kind: "rest-point", state: [0.5, 0.5], stability: "asymptotically-stable" }],
};

describe("POST /api/v1/check limits", () => {
  it("refuses a body declared larger than 1 MB with 413 before reading it", async () => {
    let pulled = 0;
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        pulled += 1;
        controller.enqueue(new Uint8Array(64 * 1024));
      },
    });
    const res = await post(stream, "198.51.100.1", { "content-length": String(2 * 1024 * 1024) });
    expect(res.status).toBe(413);
    expect(await res.json()).toEqual({
      error: { code: "payload_too_large", message: "The specification is larger than the limit of 1 MB (1,000,000 bytes)." },
    });
    // At most the stream's first prefetch, never the whole body.
    expect(pulled).toBeLessThanOrEqual(2);
  });

  it("stops reading an undeclared body as soon as it passes 1 MB", async () => {
    let sent = 0;
    const stream = new ReadableStream<Uint8Array>({
      pull(controller) {
        sent += 256 * 1024;
        if (sent > 64 * 1024 * 1024) controller.close();
        else controller.enqueue(new Uint8Array(256 * 1024).fill(32));
      },
    });
    const res = await post(stream, "198.51.100.2");
    expect(res.status).toBe(413);
    expect(((await res.json()) as { error: { code: string } }).error.code).toBe("payload_too_large");
    expect(sent).toBeLessThan(3 * 1024 * 1024);
  });

  it("answers an empty body with 400 and a sentence", async () => {
    const res = await post("", "198.51.100.3");
    expect(res.status).toBe(400);
    expect(await res.json()).toEqual({
      error: { code: "validation_failed", message: "Send the specification as the request body (restpoint/model@1 JSON)." },
    });
  });

  it("allows a burst of 10 per client, then 429 with Retry-After, without affecting other clients", async () => {
    const statuses: number[] = [];
    for (let i = 0; i < 11; i++) statuses.push((await post(" ", "203.0.113.50")).status);
    expect(statuses.slice(0, 10).every((s) => s === 400)).toBe(true);
    const limited = await post(" ", "203.0.113.50");
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get("retry-after"))).toBeGreaterThanOrEqual(1);
    expect(await limited.json()).toEqual({
      error: { code: "rate_limited", message: "Too many re-runs from this address. Wait a moment and try again." },
    });
    expect((await post(" ", "203.0.113.51")).status).toBe(400);
  });
});

describe("POST /api/v1/check verification", () => {
  it("verifies a valid spec on a check thread and returns the report", async () => {
    const res = await post(JSON.stringify(hawkDove), "192.0.2.10");
    expect(res.status).toBe(200);
    expect(res.headers.get("cache-control")).toBe("no-store");
    const body = (await res.json()) as { report: { verdict: string; experiments: { id: string; times: number[] }[] } };
    expect(body.report.verdict).toBe("confirmed");
    expect(body.report.experiments[0]?.times).toHaveLength(11);
  });

  it("answers a spec that is not JSON with 422 and the engine's errors", async () => {
    const res = await post("{ not json", "192.0.2.11");
    expect(res.status).toBe(422);
    const body = (await res.json()) as { error: { code: string; message: string; details: { path: string }[] }; report: { verdict: string } };
    expect(body.error.code).toBe("validation_failed");
    expect(body.error.message).toBe("The specification is not valid; nothing was run.");
    expect(body.report.verdict).toBe("invalid");
    expect(body.error.details.length).toBeGreaterThan(0);
  });

  it("lists schema errors with JSON pointers, e.g. a state that does not sum to 1", async () => {
    const bad = { ...hawkDove, experiments: [{ id: "run-1", initial: [0.5, 0.6], duration: 20 }] };
    const res = await post(JSON.stringify(bad), "192.0.2.12");
    expect(res.status).toBe(422);
    const body = (await res.json()) as { error: { details: { path: string }[] } };
    expect(body.error.details.map((d) => d.path)).toContain("/experiments/0/initial");
  });
});
