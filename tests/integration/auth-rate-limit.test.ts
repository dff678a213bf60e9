/** Sign-in is rate limited per client address, in the database so every process shares it. */
import "./app-env";
import { afterAll, beforeAll, expect, it } from "vitest";
import { db } from "@/db/client";
import { rateLimit } from "@/db/schema";
import { env } from "@/lib/env";
import { stopFakeSmtp } from "@/lib/fake-smtp";
import { authCall, freshIp, ready } from "./app-support";

beforeAll(ready);
afterAll(stopFakeSmtp);

it("refuses sign-in attempts beyond the limit with 429, for that address only", async () => {
  expect(env.AUTH_SIGN_IN_MAX).toBe(5); // the strict default
  const ip = freshIp();
  const attempt = (from: string) => authCall("POST", "/sign-in/email", { body: { email: "nobody@example.test", password: "wrong-password-1" }, ip: from });
  for (let i = 0; i < env.AUTH_SIGN_IN_MAX; i++) {
    const res = await attempt(ip);
    expect(res.status).toBe(401);
    expect(((await res.json()) as { code: string }).code).toBe("INVALID_EMAIL_OR_PASSWORD");
  }
  const blocked = await attempt(ip);
  expect(blocked.status).toBe(429);
  const retryAfter = Number(blocked.headers.get("x-retry-after"));
  expect(retryAfter).toBeGreaterThan(0);
  expect(retryAfter).toBeLessThanOrEqual(env.AUTH_SIGN_IN_WINDOW);

  // Another client is not affected.
  expect((await attempt(freshIp())).status).toBe(401);
  // The counters live in the shared database table.
  const rows = await db.select().from(rateLimit);
  expect(rows.some((r) => r.key.includes(ip) && r.count >= env.AUTH_SIGN_IN_MAX)).toBe(true);
});
