/**
 * The public pages render what authors wrote as text, never as markup: a spec and a model
 * entry full of HTML are deposited, then the version page and the registry results are
 * server-rendered and searched for live tags.
 */
import { createElement } from "react";
import { renderToStaticMarkup } from "react-dom/server";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { removeTempDir, setUpDatabase } from "./readers-db";
import { depositPublicModel } from "./readers-seed";

const HOSTILE = '<img src=x onerror="alert(1)">';
let slug = "";

const spec = {
  format: "restpoint/model@1",
  title: `Nest raids ${HOSTILE}`,
  summary: `<script>alert("summary")</script> and more`,
  parameters: { b: 3, c: 1 },
  game: {
    kind: "symmetric",
    strategies: ["<b>Raider</b>", "Guard & Co", HOSTILE],
    payoffs: [
      ["b - c", "b", 0],
      [0, "b - c", 1],
      [1, 0, 0],
    ],
  },
  experiments: [{ id: "run-a", initial: [0.3, 0.3, 0.4], duration: 10, samples: 11 }],
  claims: [{ id: "count", kind: "rest-point-count", count: 1, note: `<iframe src="https://example.test"></iframe>` }],
};

beforeAll(async () => {
  await setUpDatabase();
  slug = (
    await depositPublicModel([JSON.stringify(spec)], {
      title: `Raids <em>everywhere</em>`,
      summary: `<a href="javascript:alert(1)">click</a>`,
      authors: [{ name: `<svg onload=alert(1)>` }],
    })
  ).slug;
}, 120_000);

afterAll(removeTempDir);

/** Any opening tag of an element the hostile strings would create if interpreted. */
const LIVE = /<(img|script|b|em|a|svg|iframe)[\s>]/i;

describe("user-supplied text on the public pages", () => {
  it("is escaped on the version page", async () => {
    const { loadPublicVersion } = await import("@/lib/registry");
    const { PublicVersionView } = await import("@/components/public/PublicVersionView");
    const html = renderToStaticMarkup(createElement(PublicVersionView, { data: await loadPublicVersion(slug), modelPage: true }));
    // The page's own markup uses none of these elements except links, icons and the badge image; strip those first.
    const own = html
      .replace(/<a (class|href|rel|download|data-testid|aria-current)="[^"]*"[^>]*>/g, "")
      .replace(/<svg (viewBox|class|aria-hidden|fill|width|height)=[^>]*>/g, "")
      .replace(/<img src="\/badges\/[^"]*"[^>]*>/g, "");
    expect(own).not.toMatch(LIVE);
    expect(html).not.toMatch(/href="\s*javascript:/i);
    expect(html).toContain("Nest raids &lt;img src=x onerror=&quot;alert(1)&quot;&gt;");
    expect(html).toContain("&lt;b&gt;Raider&lt;/b&gt;");
    expect(html).toContain("Guard &amp; Co");
    expect(html).toContain("&lt;svg onload=alert(1)&gt;");
  });

  it("is escaped in the registry results", async () => {
    const { parseRegistryQuery, searchRegistry } = await import("@/lib/registry");
    const { RegistryResults } = await import("@/components/public/RegistryResults");
    const result = await searchRegistry(parseRegistryQuery({ strategy: "<b>Raider</b>" }));
    expect(result.entries.map((e) => e.slug)).toEqual([slug]);
    const html = renderToStaticMarkup(createElement(RegistryResults, { result }));
    const own = html.replace(/<a (class|href|rel)="[^"]*"[^>]*>/g, "").replace(/<svg (viewBox|class|aria-hidden|fill|width|height)=[^>]*>/g, "");
    expect(own).not.toMatch(LIVE);
    expect(html).toContain("Raids &lt;em&gt;everywhere&lt;/em&gt;");
    expect(html).toContain("&lt;a href=&quot;javascript:alert(1)&quot;&gt;click&lt;/a&gt;");
  });
});

describe("registry paging links and page metadata", () => {
  it("keep the search in the links to other pages and leave defaults out", async () => {
    const { parseRegistryQuery } = await import("@/lib/registry");
    const { pageHref } = await import("@/components/public/RegistryResults");
    const q = parseRegistryQuery({ q: "heron nests", dynamics: "logit", verdict: "pending", sort: "title", pageSize: "10", page: "2" });
    expect(pageHref(q, 3)).toBe("/models?q=heron+nests&dynamics=logit&verdict=pending&sort=title&pageSize=10&page=3");
    expect(pageHref(parseRegistryQuery({}), 1)).toBe("/models");
  });

  it("say whether a search found nothing or the registry is empty", async () => {
    const { parseRegistryQuery } = await import("@/lib/registry");
    const { RegistryResults } = await import("@/components/public/RegistryResults");
    const empty = (q: Record<string, string>) => ({ query: parseRegistryQuery(q), entries: [], total: 0, page: 1, pageSize: 20, pageCount: 1 });
    expect(renderToStaticMarkup(createElement(RegistryResults, { result: empty({ q: "zzz" }) }))).toContain("No public model matches this search.");
    expect(renderToStaticMarkup(createElement(RegistryResults, { result: empty({}) }))).toContain("There are no public models yet.");
  });

  it("give a version page its title, description, canonical address and Open Graph fields", async () => {
    const { loadPublicVersion } = await import("@/lib/registry");
    const { versionMetadata } = await import("@/app/(public)/models/[slug]/load");
    const data = await loadPublicVersion(slug);
    const m = versionMetadata(data);
    expect(m.title).toBe(`Nest raids ${HOSTILE}`);
    expect(m.description).toMatch(/^<a href="javascript:alert\(1\)">click<\/a> Version 1 by <svg onload=alert\(1\)>, re-run verdict: \w+\. Strategies: <b>Raider<\/b>, Guard & Co, /);
    expect(m.alternates?.canonical).toBe(`http://localhost:3000/models/${slug}`);
    expect(m.openGraph).toMatchObject({ type: "article", title: `Nest raids ${HOSTILE}`, url: `http://localhost:3000/models/${slug}`, siteName: "Restpoint" });
  });
});

