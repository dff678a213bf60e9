import { afterEach, describe, expect, it, vi } from "vitest";

// lib/env.ts reads process.env once at import, so each case imports a fresh copy.
async function loadEnv(vars: Record<string, string | undefined>) {
  vi.resetModules();
  const saved = { ...process.env };
  for (const [k, v] of Object.entries(vars)) {
    if (v === undefined) delete process.env[k];
    else process.env[k] = v;
  }
  try {
    return (await import("@/lib/env")).env;
  } finally {
    process.env = saved;
  }
}

afterEach(() => vi.resetModules());

describe("env", () => {
  it("derives the public address from the server's port when BETTER_AUTH_URL is not set", async () => {
    expect((await loadEnv({ BETTER_AUTH_URL: undefined, PORT: "3300" })).authUrl).toBe("http://localhost:3300");
    expect((await loadEnv({ BETTER_AUTH_URL: undefined, PORT: undefined })).authUrl).toBe("http://localhost:3000");
  });

  it("prefers BETTER_AUTH_URL over the port", async () => {
    const env = await loadEnv({ BETTER_AUTH_URL: "https://registry.example.org", PORT: "3300" });
    expect(env.authUrl).toBe("https://registry.example.org");
  });

  it("refuses a malformed value and names it", async () => {
    await expect(loadEnv({ PORT: "eighty" })).rejects.toThrow(/Invalid environment:\n {2}PORT: /);
    await expect(loadEnv({ RESTPOINT_WORKER_THREADS: "0" })).rejects.toThrow(/RESTPOINT_WORKER_THREADS/);
  });
});
