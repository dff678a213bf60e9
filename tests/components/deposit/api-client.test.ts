import { afterEach, describe, expect, it, vi } from "vitest";
import { ApiError, fetchJson, toApiError } from "@/components/deposit/api-client";

describe("toApiError", () => {
  it("reads the API's error shape, line numbers included", () => {
    const e = toApiError(422, {
      error: { code: "validation_failed", message: "The specification has 1 problem; nothing was stored.", details: [{ path: "/claims/0", message: "bad", line: 7 }, { path: "/x", message: "worse" }] },
    });
    expect(e).toBeInstanceOf(ApiError);
    expect(e.status).toBe(422);
    expect(e.code).toBe("validation_failed");
    expect(e.message).toBe("The specification has 1 problem; nothing was stored.");
    expect(e.details).toEqual([{ path: "/claims/0", message: "bad", line: 7 }, { path: "/x", message: "worse" }]);
  });
  it("says what it can when the body is not the API's (a proxy page, an empty answer)", () => {
    expect(toApiError(502, "<html>Bad gateway</html>").message).toBe("The server answered 502 without an explanation.");
    expect(toApiError(500, null).code).toBe("error");
    expect(toApiError(418, { error: { code: 5 } }).message).toBe("The server answered 418.");
  });
});

describe("fetchJson", () => {
  afterEach(() => vi.unstubAllGlobals());
  it("returns the JSON of a 2xx answer and throws ApiError otherwise", async () => {
    vi.stubGlobal("fetch", async (url: string) =>
      url === "/ok" ? Response.json({ a: 1 }) : Response.json({ error: { code: "not_found", message: "No such model." } }, { status: 404 }),
    );
    await expect(fetchJson<{ a: number }>("/ok")).resolves.toEqual({ a: 1 });
    await expect(fetchJson("/missing")).rejects.toMatchObject({ status: 404, code: "not_found", message: "No such model." });
  });
  it("copes with a body that is not JSON", async () => {
    vi.stubGlobal("fetch", async () => new Response("gateway timeout", { status: 504 }));
    await expect(fetchJson("/slow")).rejects.toMatchObject({ status: 504, message: "The server answered 504 without an explanation." });
  });
});
