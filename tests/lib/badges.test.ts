import { describe, expect, it } from "vitest";
import {
  VERDICT_COLOURS,
  badgeEtag,
  escapeXml,
  modelBadgeSvg,
  textWidth,
  verdictStatement,
  versionBadgeSvg,
  type VersionBadgeFacts,
} from "@/lib/badges";

const sha = "9f86d081884c7d659a2feaa0c55ad015a3bf4f1b2b0b822cd15d6c15b0f00a08";
const v3: VersionBadgeFacts = {
  slug: "rp-7f3k2q",
  number: 3,
  specSha256: sha,
  verdict: "confirmed",
  counts: { confirmed: 4, contradicted: 0, inconclusive: 0 },
  decision: "verified",
  venueName: "Journal of Fictional Foraging",
};

/** Visible text of the badge: the contents of its <text> elements, unescaped. */
function visibleText(svg: string): string {
  return [...svg.matchAll(/<text[^>]*>([^<]*)<\/text>/g)].map((m) => unescape(m[1] ?? "")).join(" | ");
}
function unescape(s: string): string {
  return s.replace(/&lt;/g, "<").replace(/&gt;/g, ">").replace(/&quot;/g, '"').replace(/&apos;/g, "'").replace(/&amp;/g, "&");
}
function title(svg: string): string {
  return unescape(/<title id="rp-badge-title">([^<]*)<\/title>/.exec(svg)?.[1] ?? "");
}

/** WCAG 2.x relative luminance and contrast ratio (W3C, Web Content Accessibility Guidelines 2.1, 1.4.3). */
function luminance(hex: string): number {
  const [r, g, b] = [1, 3, 5].map((i) => {
    const c = parseInt(hex.slice(i, i + 2), 16) / 255;
    return c <= 0.03928 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  });
  return 0.2126 * (r ?? 0) + 0.7152 * (g ?? 0) + 0.0722 * (b ?? 0);
}
function contrast(a: string, b: string): number {
  const [hi, lo] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return ((hi ?? 0) + 0.05) / ((lo ?? 0) + 0.05);
}

describe("verdictStatement", () => {
  it("states counts and never more than the engine found", () => {
    expect(verdictStatement("confirmed", { confirmed: 4, contradicted: 0, inconclusive: 0 })).toBe("all 4 claims confirmed");
    expect(verdictStatement("confirmed", { confirmed: 1, contradicted: 0, inconclusive: 0 })).toBe("1 claim confirmed");
    expect(verdictStatement("contradicted", { confirmed: 2, contradicted: 1, inconclusive: 1 })).toBe("1 of 4 claims contradicted");
    expect(verdictStatement("inconclusive", { confirmed: 1, contradicted: 0, inconclusive: 2 })).toBe("2 of 3 claims inconclusive");
    expect(verdictStatement("invalid", null)).toBe("spec invalid, not run");
    expect(verdictStatement(null, null)).toBe("not yet checked");
  });
});

describe("versionBadgeSvg", () => {
  it("shows the verdict, the decision, the version and the first 8 hex digits of the spec hash", () => {
    const svg = versionBadgeSvg(v3);
    expect(visibleText(svg)).toBe("all 4 claims confirmed | v3 · 9f86d081 · | verified");
    expect(svg).not.toContain(sha.slice(0, 9));
  });

  it("has a text alternative that names what was checked and who decided", () => {
    const svg = versionBadgeSvg(v3);
    expect(svg).toContain('role="img"');
    expect(svg).toContain('aria-labelledby="rp-badge-title"');
    expect(title(svg)).toBe(
      "Restpoint, model rp-7f3k2q version 3 (spec SHA-256 9f86d081…): all 4 claims confirmed when the Restpoint engine re-ran them; editor decision at Journal of Fictional Foraging: verified.",
    );
  });

  it("never claims correctness, peer review or a decision that was not recorded", () => {
    const pending = versionBadgeSvg({ ...v3, verdict: null, counts: null, decision: null });
    expect(visibleText(pending)).toBe("not yet checked | v3 · 9f86d081 · | no decision");
    expect(title(pending)).toContain("has not finished re-running its claims; no editor decision recorded");
    for (const svg of [versionBadgeSvg(v3), pending]) {
      expect(svg.toLowerCase()).not.toMatch(/correct|peer|reviewed|valid model|approved/);
    }
    const invalid = versionBadgeSvg({ ...v3, verdict: "invalid", counts: null, decision: null });
    expect(title(invalid)).toContain("the spec failed validation, so no claim was re-run");
  });

  it("escapes markup and drops control characters in every text it carries", () => {
    const svg = versionBadgeSvg({ ...v3, slug: 'rp-<x>&"', venueName: "A & B <script>alert(1)</script>\u0007" });
    expect(svg).not.toContain("<script>");
    expect(svg).not.toContain("\u0007");
    expect(svg).toContain("A &amp; B &lt;script&gt;alert(1)&lt;/script&gt;");
    expect(svg).toContain("rp-&lt;x&gt;&amp;&quot;");
    expect(escapeXml(`<>&"'`)).toBe("&lt;&gt;&amp;&quot;&apos;");
  });

  it("is our own shape: a rounded hexagon emblem on a card with cut corners, not two flat rectangles", () => {
    const svg = versionBadgeSvg(v3);
    expect(svg).not.toContain("<rect");
    expect(svg).toMatch(/<path d="M[^"]*Q[^"]*Z" fill="#17705a"\/>/); // the emblem: curves at six corners
    expect((svg.match(/Q/g) ?? []).length).toBe(6);
  });

  it("grows with its text and fixes each text's length so any font fits the card", () => {
    const short = versionBadgeSvg({ ...v3, decision: "declined" });
    const long = versionBadgeSvg({ ...v3, decision: "changes-requested" });
    const width = (s: string) => Number(/width="(\d+)"/.exec(s)?.[1]);
    expect(width(long)).toBeGreaterThan(width(short));
    expect(textWidth("changes requested", 10.5, true)).toBeGreaterThan(textWidth("declined", 10.5, true));
    expect((short.match(/textLength="/g) ?? []).length).toBe(3);
  });

  it("is the same bytes for the same facts, with an ETag that follows the bytes", () => {
    expect(versionBadgeSvg(v3)).toBe(versionBadgeSvg({ ...v3 }));
    expect(badgeEtag(versionBadgeSvg(v3))).toBe(badgeEtag(versionBadgeSvg({ ...v3 })));
    expect(badgeEtag(versionBadgeSvg(v3))).not.toBe(badgeEtag(versionBadgeSvg({ ...v3, decision: "declined" })));
    expect(badgeEtag("x")).toMatch(/^"[0-9a-f]{32}"$/);
  });

  it("uses text colours readable on the card (WCAG AA contrast of at least 4.5:1)", () => {
    for (const colour of Object.values(VERDICT_COLOURS)) {
      expect(contrast(colour, "#fcfbf8")).toBeGreaterThanOrEqual(4.5);
    }
  });
});

describe("modelBadgeSvg", () => {
  it("shows its latest decided version", () => {
    const { slug, ...rest } = v3;
    const svg = modelBadgeSvg({ slug, latestDecided: rest });
    expect(visibleText(svg)).toBe("all 4 claims confirmed | rp-7f3k2q v3 · | verified");
    expect(title(svg)).toContain("latest decided version 3 (spec SHA-256 9f86d081…)");
  });

  it("says so when no version has a decision yet", () => {
    const svg = modelBadgeSvg({ slug: "rp-7f3k2q", latestDecided: null });
    expect(visibleText(svg)).toBe("no decided version yet | rp-7f3k2q · | awaiting editor");
    expect(title(svg)).toBe("Restpoint, model rp-7f3k2q: no version has an editor decision yet.");
  });
});
