/** Changing roles: only administrators, through the accounts page's server action, with an audit line. */
import "./app-env";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { db } from "@/db/client";
import { auditEvent, user } from "@/db/schema";
import { IDLE } from "@/lib/action-state";
import { stopFakeSmtp } from "@/lib/fake-smtp";
import { setRole } from "@/lib/users";
import { accountIn, ready } from "./app-support";

// The action runs outside a Next request here: give it the request headers next/headers would.
const current = { cookie: "" };
vi.mock("next/headers", () => ({
  headers: async () => new Headers(current.cookie === "" ? {} : { cookie: current.cookie }),
  cookies: async () => ({ get: () => undefined }),
}));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined }));

const { changeRole } = await import("@/app/(admin)/admin/accounts/actions");

function form(userId: string, role: string): FormData {
  const f = new FormData();
  f.set("userId", userId);
  f.set("role", role);
  return f;
}

async function roleOf(id: string): Promise<string | undefined> {
  const [row] = await db.select({ role: user.role }).from(user).where(eq(user.id, id));
  return row?.role;
}

beforeAll(ready);
afterAll(stopFakeSmtp);
beforeEach(() => {
  current.cookie = "";
});

describe("changeRole (server action)", () => {
  it("promotes an author to editor when an admin asks, and records it", async () => {
    const admin = await accountIn("admin", "Ada Admin");
    const target = await accountIn("author", "Pia Author");
    current.cookie = admin.cookie;
    const state = await changeRole(IDLE, form(target.id, "editor"));
    expect(state).toEqual({ status: "ok", message: "Pia Author is now an editor." });
    expect(await roleOf(target.id)).toBe("editor");
    const events = await db.select().from(auditEvent).where(eq(auditEvent.actorId, admin.id));
    expect(events.map((e) => [e.action, JSON.parse(e.detail) as unknown])).toContainEqual([
      "account.role_changed",
      { userId: target.id, from: "author", to: "editor" },
    ]);
  });

  it("refuses anonymous callers, authors and editors", async () => {
    const target = await accountIn("author");
    const anonymous = await changeRole(IDLE, form(target.id, "admin"));
    expect(anonymous).toMatchObject({ status: "error", code: "not_signed_in", message: "Sign in to continue." });
    for (const role of ["author", "editor"] as const) {
      const caller = await accountIn(role);
      current.cookie = caller.cookie;
      const refused = await changeRole(IDLE, form(target.id, "admin"));
      expect(refused).toMatchObject({ status: "error", code: "forbidden", message: "This needs the admin role." });
    }
    expect(await roleOf(target.id)).toBe("author");
  });

  it("refuses an unknown role, an unknown account and the admin's own role", async () => {
    const admin = await accountIn("admin");
    const target = await accountIn("author");
    current.cookie = admin.cookie;
    expect(await changeRole(IDLE, form(target.id, "owner"))).toMatchObject({
      status: "error",
      code: "validation_failed",
      message: "Choose one of the roles author, editor or admin.",
      fieldErrors: { role: 'Unknown role "owner".' },
    });
    expect(await changeRole(IDLE, form("no-such-id", "editor"))).toMatchObject({ status: "error", code: "not_found", message: "No such account." });
    expect(await changeRole(IDLE, form(admin.id, "author"))).toMatchObject({
      status: "error",
      code: "conflict",
      message: "You cannot change your own role. Ask another administrator.",
    });
    expect(await roleOf(admin.id)).toBe("admin");
  });
});

describe("setRole", () => {
  it("writes no audit line when the role does not change", async () => {
    const admin = await accountIn("admin");
    const target = await accountIn("editor");
    await setRole(admin.id, target.id, "editor");
    const events = await db.select().from(auditEvent).where(eq(auditEvent.actorId, admin.id));
    expect(events).toHaveLength(0);
  });
});

describe("better-auth's admin endpoints", () => {
  it("are switched off, so nobody changes roles around the accounts page", async () => {
    const { authCall } = await import("./app-support");
    const admin = await accountIn("admin");
    const target = await accountIn("author");
    const res = await authCall("POST", "/admin/set-role", { body: { userId: target.id, role: "admin" }, cookie: admin.cookie });
    expect(res.status).toBe(404);
    const impersonate = await authCall("POST", "/admin/impersonate-user", { body: { userId: target.id }, cookie: admin.cookie });
    expect(impersonate.status).toBe(404);
    expect(await roleOf(target.id)).toBe("author");
  });
});
