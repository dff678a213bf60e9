import "./editors-env";
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { beforeAll, describe, expect, it } from "vitest";
import { DecisionsForVersion } from "@/components/editor/DecisionsForVersion";
import { recordDecision } from "@/lib/decisions";
import { addSubmitted, makeModel, makeUser, makeVenueWith, migrated } from "./editors-support";

const text = (html: string) => html.replace(/<[^>]+>/g, " ").replace(/&#x27;|&#39;/g, "'").replace(/&quot;/g, '"').replace(/\s+/g, " ").trim();

async function render(props: { modelId: string; versionNumber?: number; showComments?: boolean }): Promise<string> {
  return renderToStaticMarkup(await DecisionsForVersion(props));
}

let model: { id: string; slug: string };

beforeAll(async () => {
  await migrated();
  const author = await makeUser("Lena", "author");
  const editor = await makeUser("Mirko", "editor");
  const venue = await makeVenueWith("estuary-letters", [editor]);
  model = await makeModel(author, venue.id);
  await addSubmitted(author, model, 1);
  await recordDecision({ id: editor.id, role: "editor" }, { model: model.slug, number: 1 }, { outcome: "changes-requested", comment: "State the stability of the mixed herd." });
  await addSubmitted(author, model, 2);
});

describe("DecisionsForVersion", () => {
  it("shows a version's decision with its comment, editor and venue", async () => {
    const t = text(await render({ modelId: model.id, versionNumber: 1 }));
    expect(t).toContain("Changes requested estuary-letters review");
    expect(t).toContain("State the stability of the mixed herd.");
    expect(t).toContain("Changes requested by Mirko ·");
  });

  it("says so when the version has no decision, and can leave comments out", async () => {
    expect(text(await render({ modelId: model.id, versionNumber: 2 }))).toBe("No editor has decided on version 2 yet.");
    const all = text(await render({ modelId: model.id, showComments: false }));
    expect(all).toContain("version 1 · estuary-letters review");
    expect(all).not.toContain("State the stability");
  });
});
