import "./editors-env";
import { beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { db, rawClient } from "@/db/client";
import { auditEvent, decision, model } from "@/db/schema";
import {
  ALREADY_DECIDED_MESSAGE,
  CONTRADICTED_MESSAGE,
  NO_REPORT_MESSAGE,
  NO_VENUE_DECISION_MESSAGE,
  NOT_LATEST_MESSAGE,
  NOT_SUBMITTED_MESSAGE,
  OUTCOME_MISSING_MESSAGE,
  OWN_MODEL_MESSAGE,
  decisionMail,
  latestDecidedVersion,
  listDecisionsForModel,
  recordDecision,
} from "@/lib/decisions";
import { Conflict, Forbidden, NotFound, ValidationError } from "@/lib/errors";
import { listCapturedMail } from "@/lib/captured-mail";
import { OUTCOME_WORDS } from "@/components/editor/labels";
import {
  NOT_EDITOR_MESSAGE,
  NOT_OWNER_SUBMIT_MESSAGE,
  NO_VENUE_MESSAGE,
  OLDER_VERSION_MESSAGE,
  OTHER_VENUE_MESSAGE,
  isUniqueViolation,
  latestSubmittedVersion,
  listSubmissionsForModel,
  submitVersion,
} from "@/lib/venues";
import { addSubmitted, addVersion, claim, makeModel, makeUser, makeVenueWith, migrated, setVisibility, type Person } from "./editors-support";

let author: Person;
let otherAuthor: Person;
let editor: Person;
let editor2: Person;
let outsider: Person; // editor of another venue
let admin: Person;
let venueA: { id: string; slug: string; name: string };
let venueB: { id: string; slug: string; name: string };

const as = (p: Person) => ({ id: p.id, role: p.role });

async function rejects(p: Promise<unknown>): Promise<Error> {
  try {
    await p;
  } catch (e) {
    if (e instanceof Error) return e;
    throw new Error(`rejected with a non-Error: ${String(e)}`);
  }
  throw new Error("expected a rejection");
}

beforeAll(async () => {
  await migrated();
  author = await makeUser("Ada", "author");
  otherAuthor = await makeUser("Bram", "author");
  editor = await makeUser("Cleo", "editor");
  editor2 = await makeUser("Dara", "editor");
  outsider = await makeUser("Emil", "editor");
  admin = await makeUser("Faye", "admin");
  venueA = await makeVenueWith("meadow-letters", [editor, editor2]);
  venueB = await makeVenueWith("reef-notes", [outsider]);
});

describe("submitVersion", () => {
  it("puts a version before the model's venue once, and records it in the audit trail", async () => {
    const m = await makeModel(author, venueA.id);
    await addVersion(author, m, 1);
    const first = await submitVersion(as(author), { model: m.slug, number: 1 });
    expect(first.status).toBe("created");
    expect(first.submission.venue.slug).toBe(venueA.slug);
    const again = await submitVersion(as(author), { model: m.slug, number: 1, venueSlug: venueA.slug });
    expect(again.status).toBe("existing");
    expect(again.submission.id).toBe(first.submission.id);
    expect((await listSubmissionsForModel(m.id)).map((s) => s.versionNumber)).toEqual([1]);
    const events = await db.select().from(auditEvent).where(and(eq(auditEvent.modelId, m.id), eq(auditEvent.action, "version.submitted")));
    expect(events).toHaveLength(1);
    expect(JSON.parse(events[0]?.detail ?? "{}")).toEqual({ number: 1, venue: venueA.slug });
  });

  it("refuses what the owner may not submit, with a message for each case", async () => {
    const m = await makeModel(author, venueA.id);
    await addVersion(author, m, 1);
    await addVersion(author, m, 2);
    // Another author cannot even see the private model.
    expect(await rejects(submitVersion(as(otherAuthor), { model: m.slug, number: 1 }))).toBeInstanceOf(NotFound);
    // The venue's editor sees it but may not submit for the owner.
    const notOwner = await rejects(submitVersion(as(editor), { model: m.slug, number: 1 }));
    expect(notOwner).toBeInstanceOf(Forbidden);
    expect(notOwner.message).toBe(NOT_OWNER_SUBMIT_MESSAGE);
    const otherVenue = await rejects(submitVersion(as(author), { model: m.slug, number: 1, venueSlug: venueB.slug }));
    expect(otherVenue).toBeInstanceOf(ValidationError);
    expect(otherVenue.message).toBe(OTHER_VENUE_MESSAGE);
    expect(await rejects(submitVersion(as(author), { model: m.slug, number: 9 }))).toBeInstanceOf(NotFound);
    await submitVersion(as(author), { model: m.slug, number: 2 });
    const older = await rejects(submitVersion(as(author), { model: m.slug, number: 1 }));
    expect(older).toBeInstanceOf(Conflict);
    expect(older.message).toBe(OLDER_VERSION_MESSAGE);

    const loose = await makeModel(author, null);
    await addVersion(author, loose, 1);
    const noVenue = await rejects(submitVersion(as(author), { model: loose.slug, number: 1 }));
    expect(noVenue).toBeInstanceOf(ValidationError);
    expect(noVenue.message).toBe(NO_VENUE_MESSAGE);
  });
});

describe("recordDecision", () => {
  it("records the decision, audits it, mails the owner, and publishes a verified model", async () => {
    const m = await makeModel(author, venueA.id, { title: "Herd split on the salt meadow" });
    await addSubmitted(author, m, 1);
    const d = await recordDecision(as(editor), { model: m.slug, number: 1 }, { outcome: "verified", comment: "All claims re-run and match." });
    expect(d.outcome).toBe("verified");
    expect(d.venue.slug).toBe(venueA.slug);
    expect(d.editor.name).toBe("Cleo");

    const [row] = await db.select().from(model).where(eq(model.id, m.id));
    expect(row?.visibility).toBe("public");

    const events = await db.select().from(auditEvent).where(and(eq(auditEvent.modelId, m.id), eq(auditEvent.action, "decision.recorded")));
    expect(events).toHaveLength(1);
    expect(events[0]?.actorId).toBe(editor.id);
    expect(JSON.parse(events[0]?.detail ?? "{}")).toMatchObject({ outcome: "verified", number: 1, madePublic: true, comment: "All claims re-run and match." });

    const mails = await listCapturedMail({ to: author.email });
    const mail = mails.find((x) => x.subject === "Verified: version 1 of Herd split on the salt meadow");
    expect(mail?.text).toContain("All claims re-run and match.");
    expect(mail?.text).toContain(`/workspace/models/${m.slug}/v/1`);
    expect(mail?.text).toContain("The model is now public");

    expect((await listDecisionsForModel(m.id)).map((x) => x.outcome)).toEqual(["verified"]);
    expect((await latestDecidedVersion(m.id))?.number).toBe(1);
  });

  it("lets exactly one of two concurrent decisions land", async () => {
    const m = await makeModel(author, venueA.id);
    await addSubmitted(author, m, 1);
    const results = await Promise.allSettled([
      recordDecision(as(editor), { model: m.slug, number: 1 }, { outcome: "changes-requested", comment: "Check the second claim." }),
      recordDecision(as(editor2), { model: m.slug, number: 1 }, { outcome: "declined", comment: "Out of scope." }),
    ]);
    const landed = results.filter((r) => r.status === "fulfilled");
    const refused = results.filter((r): r is PromiseRejectedResult => r.status === "rejected");
    expect(landed).toHaveLength(1);
    expect(refused).toHaveLength(1);
    expect(refused[0]?.reason).toBeInstanceOf(Conflict);
    expect((refused[0]?.reason as Error).message).toBe(ALREADY_DECIDED_MESSAGE(1));
    expect(await db.$count(decision, eq(decision.modelId, m.id))).toBe(1);
    expect(await db.$count(auditEvent, and(eq(auditEvent.modelId, m.id), eq(auditEvent.action, "decision.recorded")))).toBe(1);
  });

  it("refuses a decision on a version that is not the latest submitted one", async () => {
    const m = await makeModel(author, venueA.id);
    await addSubmitted(author, m, 1);
    await addSubmitted(author, m, 2);
    await addVersion(author, m, 3); // uploaded, not submitted
    const older = await rejects(recordDecision(as(editor), { model: m.slug, number: 1 }, { outcome: "declined", comment: "x" }));
    expect(older).toBeInstanceOf(Conflict);
    expect(older.message).toBe(NOT_LATEST_MESSAGE(1, 2));
    expect(older.message).toBe("Version 1 is not the latest submitted version of this model: version 2 is. Decide on version 2 instead.");
    const unsubmitted = await rejects(recordDecision(as(editor), { model: m.slug, number: 3 }, { outcome: "declined", comment: "x" }));
    expect(unsubmitted.message).toBe(NOT_SUBMITTED_MESSAGE(3, venueA.name));
    expect(await rejects(recordDecision(as(editor), { model: m.slug, number: 7 }, { outcome: "declined", comment: "x" }))).toBeInstanceOf(NotFound);
    expect((await latestSubmittedVersion(venueA.id, m.id))?.number).toBe(2);
  });

  it("refuses a second decision on a decided version", async () => {
    const m = await makeModel(author, venueA.id);
    await addSubmitted(author, m, 1);
    await recordDecision(as(editor), { model: m.slug, number: 1 }, { outcome: "changes-requested", comment: "Tighten tolerance." });
    const again = await rejects(recordDecision(as(editor2), { model: m.slug, number: 1 }, { outcome: "verified", comment: "ok" }));
    expect(again).toBeInstanceOf(Conflict);
    expect(again.message).toBe(ALREADY_DECIDED_MESSAGE(1));
  });

  it("does not let an author decide on their own model, even as an editor of its venue", async () => {
    const m = await makeModel(editor, venueA.id);
    await addSubmitted(editor, m, 1);
    const own = await rejects(recordDecision(as(editor), { model: m.slug, number: 1 }, { outcome: "verified", comment: "mine" }));
    expect(own).toBeInstanceOf(Forbidden);
    expect(own.message).toBe(OWN_MODEL_MESSAGE);
  });

  it("hides another venue's private submissions and forbids deciding on its public ones", async () => {
    const m = await makeModel(author, venueA.id);
    await addSubmitted(author, m, 1);
    const hidden = await rejects(recordDecision(as(outsider), { model: m.slug, number: 1 }, { outcome: "declined", comment: "no" }));
    expect(hidden).toBeInstanceOf(NotFound);
    await setVisibility(m.id, "public");
    const forbidden = await rejects(recordDecision(as(outsider), { model: m.slug, number: 1 }, { outcome: "declined", comment: "no" }));
    expect(forbidden).toBeInstanceOf(Forbidden);
    expect(forbidden.message).toBe(NOT_EDITOR_MESSAGE);
    // An admin oversees venues but decides only where assigned as an editor.
    const adminTry = await rejects(recordDecision(as(admin), { model: m.slug, number: 1 }, { outcome: "declined", comment: "no" }));
    expect(adminTry.message).toBe(NOT_EDITOR_MESSAGE);
    expect(await rejects(recordDecision(as(outsider), { model: "rp-nothing", number: 1 }, { outcome: "declined", comment: "no" }))).toBeInstanceOf(NotFound);
  });

  it("refuses verified while the check is pending or a claim is contradicted", async () => {
    const pending = await makeModel(author, venueA.id);
    await addSubmitted(author, pending, 1, null);
    const p = await rejects(recordDecision(as(editor), { model: pending.slug, number: 1 }, { outcome: "verified", comment: "x" }));
    expect(p.message).toBe(NO_REPORT_MESSAGE(1));
    // Changes may be requested before the report is in.
    await recordDecision(as(editor), { model: pending.slug, number: 1 }, { outcome: "changes-requested", comment: "Add the stability." });

    const bad = await makeModel(author, venueA.id);
    await addSubmitted(author, bad, 1, "contradicted", [claim("mixed-herd", "contradicted", 0.2)]);
    const c = await rejects(recordDecision(as(editor), { model: bad.slug, number: 1 }, { outcome: "verified", comment: "x" }));
    expect(c).toBeInstanceOf(Conflict);
    expect(c.message).toBe(CONTRADICTED_MESSAGE(1, "contradicted"));
  });

  it("checks the fields and the venue", async () => {
    const m = await makeModel(author, venueA.id);
    await addSubmitted(author, m, 1);
    const empty = await rejects(recordDecision(as(editor), { model: m.slug, number: 1 }, { outcome: "declined", comment: "   " }));
    expect(empty).toBeInstanceOf(ValidationError);
    expect((empty as ValidationError).problems).toEqual([{ path: "/comment", message: "Write a comment for the authors." }]);
    const badOutcome = await rejects(
      recordDecision(as(editor), { model: m.slug, number: 1 }, { outcome: "accepted", comment: "x" }),
    );
    expect((badOutcome as ValidationError).problems).toEqual([{ path: "/outcome", message: "Choose Verified, Changes requested or Declined." }]);
    expect((badOutcome as ValidationError).message).toBe("Choose a decision before recording it.");
    // The field message names the choices as the form labels them.
    for (const word of Object.values(OUTCOME_WORDS)) expect(OUTCOME_MISSING_MESSAGE).toContain(word);
    expect((empty as ValidationError).message).toBe("Write a comment for the authors before recording the decision.");
    const neither = await rejects(recordDecision(as(editor), { model: m.slug, number: 1 }, { comment: "" }));
    expect((neither as ValidationError).message).toBe("Choose a decision and write a comment for the authors before recording it.");
    const badVenue = await rejects(recordDecision(as(editor), { model: m.slug, number: 1 }, { outcome: "declined", comment: "x", venue: 7 }));
    expect((badVenue as ValidationError).message).toBe("The decision could not be recorded as sent: see the marked fields.");
    expect(await rejects(recordDecision(as(editor), { model: m.slug, number: 1 }, { outcome: "declined", comment: "x", venue: "no-such" }))).toBeInstanceOf(NotFound);

    const loose = await makeModel(author, null, { visibility: "public" });
    await addVersion(author, loose, 1);
    const noVenue = await rejects(recordDecision(as(editor), { model: loose.slug, number: 1 }, { outcome: "declined", comment: "x" }));
    expect(noVenue.message).toBe(NO_VENUE_DECISION_MESSAGE);
  });

  it("keeps decisions append-only in the database itself", async () => {
    const m = await makeModel(author, venueA.id);
    await addSubmitted(author, m, 1);
    const d = await recordDecision(as(editor), { model: m.slug, number: 1 }, { outcome: "declined", comment: "x" });
    await expect(rawClient().execute({ sql: "update decision set outcome = 'verified' where id = ?", args: [d.id] })).rejects.toThrow(/append-only/);
    await expect(rawClient().execute("delete from audit_event")).rejects.toThrow(/append-only/);
  });
});

describe("decisionMail", () => {
  it("names the venue, the version, the outcome and the comment, and links the version", () => {
    const mail = decisionMail(
      { name: "Ada", email: "ada@example.test" },
      { slug: "rp-abc123", title: "Herds" },
      { outcome: "changes-requested", comment: "Line one\nLine two", versionNumber: 2, venue: { id: "v", slug: "meadow", name: "Meadow Letters" } },
      false,
      "https://restpoint.example/",
    );
    expect(mail.to).toBe("ada@example.test");
    expect(mail.subject).toBe("Changes requested: version 2 of Herds");
    expect(mail.text).toContain('An editor of Meadow Letters recorded a decision on version 2 of "Herds" (rp-abc123):');
    expect(mail.text).toContain("  Line one\n  Line two");
    expect(mail.text).toContain("Upload a new version of the spec to answer");
    expect(mail.text).toContain("https://restpoint.example/workspace/models/rp-abc123/v/2");
    expect(mail.text).not.toContain("now public");
  });
});

describe("isUniqueViolation", () => {
  it("recognises SQLite's unique errors and nothing else", () => {
    expect(isUniqueViolation(Object.assign(new Error("x"), { code: "SQLITE_CONSTRAINT_UNIQUE" }))).toBe(true);
    expect(isUniqueViolation(new Error("wrapped", { cause: new Error("UNIQUE constraint failed: decision.version_id") }))).toBe(true);
    expect(isUniqueViolation(Object.assign(new Error("fk"), { code: "SQLITE_CONSTRAINT_FOREIGNKEY" }))).toBe(false);
    expect(isUniqueViolation("text")).toBe(false);
  });
});
