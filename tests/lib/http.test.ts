/** lib/errors.ts and lib/http.ts: every error class maps to its status and JSON body. */
import { describe, expect, it, vi } from "vitest";
import { z } from "zod";
import { Conflict, Forbidden, NotFound, NotSignedIn, PayloadTooLarge, RateLimited, ValidationError } from "@/lib/errors";
import { errorResponse, GENERIC_500_MESSAGE, parseWith, readJson, route, zodDetails } from "@/lib/http";

async function answer(e: unknown): Promise<{ status: number; body: unknown; headers: Headers }> {
  const res = errorResponse(e);
  return { status: res.status, body: await res.json(), headers: res.headers };
}

describe("errorResponse", () => {
  it("maps each error class to its status, code and message", async () => {
    const cases: [unknown, number, string, string][] = [
      [new ValidationError("Bad fields.", [{ path: "/title", message: "Too long." }]), 422, "validation_failed", "Bad fields."],
      [new ValidationError("Not JSON.", [], 400), 400, "validation_failed", "Not JSON."],
      [new NotSignedIn(), 401, "not_signed_in", "Sign in to continue."],
      [new Forbidden(), 403, "forbidden", "Your account may not do this."],
      [new NotFound("model"), 404, "not_found", "No such model."],
      [new Conflict("Decided already."), 409, "conflict", "Decided already."],
      [new PayloadTooLarge(2 * 1024 * 1024), 413, "payload_too_large", "The upload is larger than the limit of 2 MiB."],
      [new PayloadTooLarge(1536), 413, "payload_too_large", "The upload is larger than the limit of 1.5 KiB."],
      [new RateLimited(30), 429, "rate_limited", "Too many attempts. Wait a moment and try again."],
    ];
    for (const [error, status, code, message] of cases) {
      const { status: s, body } = await answer(error);
      expect(s).toBe(status);
      expect(body).toMatchObject({ error: { code, message } });
    }
  });

  it("includes details only when there are some", async () => {
    expect((await answer(new ValidationError("Bad.", [{ path: "/a", message: "m" }]))).body).toEqual({
      error: { code: "validation_failed", message: "Bad.", details: [{ path: "/a", message: "m" }] },
    });
    expect((await answer(new ValidationError("Bad."))).body).toEqual({ error: { code: "validation_failed", message: "Bad." } });
  });

  it("sets Retry-After for RateLimited", async () => {
    expect((await answer(new RateLimited(17))).headers.get("retry-after")).toBe("17");
  });

  it("answers anything else with 500, a generic sentence and a log line", async () => {
    const log = vi.spyOn(console, "error").mockImplementation(() => undefined);
    const { status, body } = await answer(new Error("database password is hunter2"));
    expect(status).toBe(500);
    expect(body).toEqual({ error: { code: "internal_error", message: GENERIC_500_MESSAGE } });
    expect(JSON.stringify(body)).not.toContain("hunter2");
    expect(log).toHaveBeenCalledOnce();
    log.mockRestore();
  });
});

describe("route, readJson, parseWith", () => {
  const schema = z.object({ title: z.string().min(1), claims: z.array(z.object({ state: z.array(z.number()) })) });
  const handler = route(async (req: Request) => Response.json(await readJson(req, schema)));
  const post = (body: string) => handler(new Request("http://x.test/api", { method: "POST", body, headers: { "content-type": "application/json" } }));

  it("passes good input through", async () => {
    const res = await post(JSON.stringify({ title: "t", claims: [] }));
    expect(res.status).toBe(200);
  });

  it("answers 400 for a body that is not JSON", async () => {
    const res = await post("{nope");
    expect(res.status).toBe(400);
    expect(await res.json()).toEqual({ error: { code: "validation_failed", message: "The request body is not valid JSON." } });
  });

  it("answers 422 with JSON-pointer details for a body that breaks the schema", async () => {
    const res = await post(JSON.stringify({ title: "", claims: [{ state: ["x"] }] }));
    expect(res.status).toBe(422);
    const body = (await res.json()) as { error: { message: string; details: { path: string }[] } };
    expect(body.error.message).toBe("The request has invalid fields.");
    expect(body.error.details.map((d) => d.path)).toEqual(["/title", "/claims/0/state/0"]);
  });

  it("escapes pointer characters in keys (RFC 6901)", () => {
    const r = z.object({ "a/b~c": z.number() }).safeParse({ "a/b~c": "x" });
    expect(r.success).toBe(false);
    if (!r.success) expect(zodDetails(r.error)[0]?.path).toBe("/a~1b~0c");
  });

  it("parseWith throws a ValidationError with the given message", () => {
    expect(() => parseWith(schema, {}, "Check the deposit.")).toThrow("Check the deposit.");
  });
});
