/**
 * The workspace's server actions against a real SQLite file. The signed-in user and Next's
 * request-bound helpers (redirect, revalidatePath) are stood in for: outside a request they
 * cannot run, and what they are given is what these tests check.
 */
import "./deposit-env";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { EMPTY_MODEL_FORM, UNEXPECTED_FORM_MESSAGE } from "@/components/deposit/model-form";
import { makeUser, makeVenue, migrated } from "./deposit-support";

const session = vi.hoisted(() => ({ actor: null as null | { userId: string; name: string; email: string; role: "author" | "editor" | "admin"; via: "session"; tokenId: null } }));
const redirects = vi.hoisted(() => [] as string[]);

vi.mock("@/lib/authz", async (original) => {
  const real = await original<typeof import("@/lib/authz")>();
  const { NotSignedIn } = await import("@/lib/errors");
  return {
    ...real,
    requireUser: async () => {
      if (session.actor === null) throw new NotSignedIn();
      return session.actor;
    },
  };
});
vi.mock("next/navigation", () => ({
  redirect: (url: string) => {
    redirects.push(url);
    throw new Error(`NEXT_REDIRECT ${url}`);
  },
}));
vi.mock("next/cache", () => ({ revalidatePath: () => undefined }));

type Actions = typeof import("@/app/(workspace)/workspace/models/actions");
type TokenActions = typeof import("@/app/(workspace)/workspace/settings/tokens/actions");
let actions: Actions;
let tokenActions: TokenActions;

beforeAll(async () => {
  await migrated();
  actions = await import("@/app/(workspace)/workspace/models/actions");
  tokenActions = await import("@/app/(workspace)/workspace/settings/tokens/actions");
});

async function signInAs(name: string, role: "author" | "editor" | "admin" = "author") {
  const u = await makeUser(name, role);
  session.actor = { userId: u.id, name, email: u.email, role, via: "session", tokenId: null };
  return u;
}

beforeEach(() => {
  session.actor = null;
  redirects.length = 0;
});

describe("createModelAction", () => {
  it("creates the entry and redirects to its page", async () => {
    await signInAs("Juno");
    await expect(actions.createModelAction({ ...EMPTY_MODEL_FORM, title: "Tidepool snails" })).rejects.toThrow("NEXT_REDIRECT");
    expect(redirects).toHaveLength(1);
    expect(redirects[0]).toMatch(/^\/workspace\/models\/rp-[a-z0-9]{6}\?created=1$/);
  });

  it("answers the server's field problems with pointers into the form as the author sees it", async () => {
    await signInAs("Kai");
    const values = {
      ...EMPTY_MODEL_FORM,
      title: "Tidepool snails",
      authors: [
        { name: "", orcid: "", affiliation: "" },
        { name: "K. Limpet", orcid: "0000-0002-1825-0098", affiliation: "" },
      ],
    };
    const r = await actions.createModelAction(values);
    expect(r).toEqual({
      ok: false,
      message: "The model entry has invalid fields.",
      problems: [{ path: "/authors/0/orcid", message: "Not a valid ORCID iD (0000-0000-0000-000X with a correct check character)." }],
    });
    expect(redirects).toEqual([]);
  });

  it("refuses values that do not have the form's shape, and anonymous callers", async () => {
    await signInAs("Lia");
    expect(await actions.createModelAction({ title: 42 })).toEqual({ ok: false, message: UNEXPECTED_FORM_MESSAGE, problems: [] });
    session.actor = null;
    await expect(actions.createModelAction({ ...EMPTY_MODEL_FORM, title: "x" })).rejects.toThrow("Sign in to continue.");
  });

  it("refuses a venue that does not exist", async () => {
    await signInAs("Mio");
    const r = await actions.createModelAction({ ...EMPTY_MODEL_FORM, title: "x", venueId: "no-such-venue" });
    expect(r).toEqual({ ok: false, message: "The model entry has invalid fields.", problems: [{ path: "/venueId", message: "No such venue." }] });
  });
});

describe("updateModelAction and submitVersionAction", () => {
  it("saves the owner's entry and answers 'not found' to anyone else", async () => {
    await signInAs("Nia");
    await actions.createModelAction({ ...EMPTY_MODEL_FORM, title: "Barnacle spacing" }).catch(() => undefined);
    const slug = (redirects[0] ?? "").split("/")[3]?.split("?")[0] ?? "";
    const saved = await actions.updateModelAction(slug, { ...EMPTY_MODEL_FORM, title: "Barnacle spacing, revised" });
    expect(saved).toEqual({ ok: true, message: "The model entry was saved." });
    await signInAs("Oto");
    expect(await actions.updateModelAction(slug, { ...EMPTY_MODEL_FORM, title: "taken" })).toEqual({ ok: false, message: "No such model.", problems: [] });
  });

  it("submits the newest version to the entry's venue, and says when there is no venue", async () => {
    const owner = await signInAs("Pia");
    const venueId = await makeVenue("shore-notes");
    await actions.createModelAction({ ...EMPTY_MODEL_FORM, title: "Crab burrows" }).catch(() => undefined);
    const slug = (redirects.at(-1) ?? "").split("/")[3]?.split("?")[0] ?? "";
    const { addVersion } = await import("@/lib/versions");
    const { readFileSync } = await import("node:fs");
    await addVersion(slug, readFileSync("schemas/examples/fog-dune-beetles.json", "utf8"), { id: owner.id, role: "author" });
    expect(await actions.submitVersionAction(slug, 1)).toEqual({
      ok: false,
      message: "Choose the venue in the model entry before submitting a version.",
    });
    await actions.updateModelAction(slug, { ...EMPTY_MODEL_FORM, title: "Crab burrows", venueId });
    const first = await actions.submitVersionAction(slug, 1);
    expect(first.ok).toBe(true);
    expect(first.message).toBe("v1 was submitted to shore-notes; its editors now see it in their queue.");
    expect(await actions.submitVersionAction(slug, 1)).toEqual({ ok: true, message: "v1 was submitted to shore-notes already." });
  });
});

describe("token actions", () => {
  it("creates a token once, refuses an empty name, and revokes only the owner's tokens", async () => {
    await signInAs("Quin");
    const created = await tokenActions.createTokenAction("field laptop");
    expect(created.ok).toBe(true);
    if (!created.ok) return;
    expect(created.token).toMatch(/^rp_/);
    expect(await tokenActions.createTokenAction("  ")).toEqual({ ok: false, message: "Give the token a name (what will use it)." });
    const { listApiTokens } = await import("@/lib/api-tokens");
    const id = (await listApiTokens(session.actor?.userId ?? ""))[0]?.id ?? "";
    await signInAs("Rue");
    expect(await tokenActions.revokeTokenAction(id)).toEqual({ ok: false, message: "No such token." });
  });
});
