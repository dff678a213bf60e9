/**
 * The editors' server actions (decision form, admin venue forms) against a real SQLite file.
 * The signed-in user and Next's request-bound helpers are stood in for, as in the workspace
 * action tests: outside a request they cannot run.
 */
import "./editors-env";
import { beforeAll, beforeEach, describe, expect, it, vi } from "vitest";
import { eq } from "drizzle-orm";
import { db } from "@/db/client";
import { decision, venue, venueEditor } from "@/db/schema";
import { addSubmitted, makeModel, makeUser, makeVenueWith, migrated, type Person } from "./editors-support";

type Role = "author" | "editor" | "admin";
const session = vi.hoisted(() => ({ actor: null as null | { userId: string; name: string; email: string; role: "author" | "editor" | "admin"; via: "session"; tokenId: null } }));
const redirects = vi.hoisted(() => [] as string[]);

vi.mock("@/lib/authz", async (original) => {
  const real = await original<typeof import("@/lib/authz")>();
  const { Forbidden, NotSignedIn } = await import("@/lib/errors");
  return {
    ...real,
    requireRole: async (...roles: Role[]) => {
      if (session.actor === null) throw new NotSignedIn();
      if (!roles.includes(session.actor.role)) throw new Forbidden(`This needs the ${roles.join(" or ")} role.`, roles);
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

type ReviewActions = typeof import("@/app/(workspace)/workspace/venues/[venue]/review/[slug]/v/[number]/actions");
type AdminActions = typeof import("@/app/(admin)/admin/venues/actions");
let review: ReviewActions;
let admin: AdminActions;
let author: Person;
let editor: Person;
let theVenue: { id: string; slug: string; name: string };

function as(p: Person, name: string) {
  session.actor = { userId: p.id, name, email: p.email, role: p.role as Role, via: "session", tokenId: null };
}
function form(fields: Record<string, string>): FormData {
  const f = new FormData();
  for (const [k, v] of Object.entries(fields)) f.set(k, v);
  return f;
}

beforeAll(async () => {
  await migrated();
  review = await import("@/app/(workspace)/workspace/venues/[venue]/review/[slug]/v/[number]/actions");
  admin = await import("@/app/(admin)/admin/venues/actions");
  author = await makeUser("Olga", "author");
  editor = await makeUser("Piet", "editor");
  theVenue = await makeVenueWith("action-letters", [editor]);
});

beforeEach(() => {
  session.actor = null;
  redirects.length = 0;
});

describe("decideAction", () => {
  it("records the decision and goes back to the review with a confirmation", async () => {
    const m = await makeModel(author, theVenue.id);
    await addSubmitted(author, m, 1);
    as(editor, "Piet");
    const target = { venue: theVenue.slug, slug: m.slug, number: 1 };
    await expect(review.decideAction(target, { status: "idle" }, form({ outcome: "declined", comment: "Out of scope for the venue." }))).rejects.toThrow("NEXT_REDIRECT");
    expect(redirects).toEqual([`/workspace/venues/${theVenue.slug}/review/${m.slug}/v/1?decided=1`]);
    const rows = await db.select().from(decision).where(eq(decision.modelId, m.id));
    expect(rows.map((r) => r.outcome)).toEqual(["declined"]);
  });

  it("puts field problems beside their fields and keeps what was typed", async () => {
    const m = await makeModel(author, theVenue.id);
    await addSubmitted(author, m, 1);
    as(editor, "Piet");
    const state = await review.decideAction({ venue: theVenue.slug, slug: m.slug, number: 1 }, { status: "idle" }, form({ comment: "half a thought" }));
    expect(state).toEqual({
      status: "error",
      message: "Choose a decision before recording it.",
      fieldErrors: { outcome: "Choose Verified, Changes requested or Declined." },
      values: { outcome: undefined, comment: "half a thought" },
    });
  });

  it("answers a refusal in a sentence, for the author and for a second decision", async () => {
    const m = await makeModel(author, theVenue.id);
    await addSubmitted(author, m, 1);
    as(author, "Olga");
    const byAuthor = await review.decideAction({ venue: theVenue.slug, slug: m.slug, number: 1 }, { status: "idle" }, form({ outcome: "verified", comment: "mine" }));
    expect(byAuthor).toMatchObject({ status: "error", message: "This needs the editor or admin role." });
    as(editor, "Piet");
    await expect(review.decideAction({ venue: theVenue.slug, slug: m.slug, number: 1 }, { status: "idle" }, form({ outcome: "declined", comment: "No." }))).rejects.toThrow("NEXT_REDIRECT");
    const again = await review.decideAction({ venue: theVenue.slug, slug: m.slug, number: 1 }, { status: "idle" }, form({ outcome: "verified", comment: "Yes." }));
    expect(again).toMatchObject({ status: "error", message: "A decision on version 1 has already been recorded; decisions are final." });
  });
});

describe("admin venue actions", () => {
  it("creates a venue, or lists the field problems", async () => {
    const boss = await makeUser("Quinn", "admin");
    as(boss, "Quinn");
    const slug = `tidal-${crypto.randomUUID().slice(0, 6)}`;
    expect(await admin.createVenueAction({ status: "idle" }, form({ slug, name: "Tidal Notes", description: "" }))).toEqual({ status: "ok", message: "Created Tidal Notes." });
    const bad = await admin.createVenueAction({ status: "idle" }, form({ slug: "Bad Slug", name: "", description: "" }));
    expect(bad).toEqual({
      status: "error",
      message: "The venue has invalid fields.",
      fieldErrors: { slug: "Lower-case letters, digits and single hyphens, like tidewater-letters.", name: "The venue needs a name." },
      values: { slug: "Bad Slug", name: "", description: "" },
    });
    expect(await admin.createVenueAction({ status: "idle" }, form({ slug, name: "Again", description: "" }))).toMatchObject({ status: "error", message: "A venue with this short name exists already." });
  });

  it("assigns and removes editors, and refuses non-admins", async () => {
    const boss = await makeUser("Rosa", "admin");
    const newEditor = await makeUser("Sami", "editor");
    const [v] = await db.select().from(venue).where(eq(venue.id, theVenue.id));
    as(boss, "Rosa");
    expect(await admin.assignEditorAction(v?.slug ?? "", { status: "idle" }, form({ email: newEditor.email }))).toEqual({ status: "ok", message: "Sami edits this venue." });
    expect(await admin.assignEditorAction(v?.slug ?? "", { status: "idle" }, form({ email: "nobody@example.test" }))).toMatchObject({
      status: "error",
      fieldErrors: { email: "No account has this e-mail address." },
    });
    expect(await admin.removeEditorAction(v?.slug ?? "", newEditor.id, { status: "idle" }, form({}))).toEqual({ status: "ok", message: "Removed." });
    expect(await db.$count(venueEditor, eq(venueEditor.userId, newEditor.id))).toBe(0);
    as(editor, "Piet");
    expect(await admin.createVenueAction({ status: "idle" }, form({ slug: "x-y", name: "X" }))).toMatchObject({ status: "error", message: "This needs the admin role." });
  });
});
