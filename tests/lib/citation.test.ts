import { describe, expect, it } from "vitest";
import { citeKey, escapeBibtex, toBibtex, toPlainText, type CitationInput } from "@/lib/citation";

const HASH = "3f7a0c1e9b2d4f6a8c0e2b4d6f8a0c2e4b6d8f0a2c4e6b8d0f2a4c6e8b0d2f4a";

const base: CitationInput = {
  slug: "rp-7f3k2q",
  versionNumber: 2,
  title: "Heron foraging at the estuary",
  authors: [{ name: "Ada Marsh" }, { name: "Tomas Reed" }],
  registeredAt: new Date(Date.UTC(2026, 4, 17, 12)),
  specSha256: HASH,
  url: "https://restpoint.example/models/rp-7f3k2q/v/2",
  manuscript: { title: "Shared nests", doi: "10.1234/abc_def.5", year: 2025 },
};

describe("escapeBibtex", () => {
  // The ten characters TeX treats as special (common practice: The TeXbook, ch. 7, from memory).
  it("escapes every TeX special character", () => {
    expect(escapeBibtex("a & b")).toBe("a \\& b");
    expect(escapeBibtex("50%")).toBe("50\\%");
    expect(escapeBibtex("$5")).toBe("\\$5");
    expect(escapeBibtex("#1")).toBe("\\#1");
    expect(escapeBibtex("x_i")).toBe("x\\_i");
    expect(escapeBibtex("{b}")).toBe("\\{b\\}");
    expect(escapeBibtex("a~b")).toBe("a\\textasciitilde{}b");
    expect(escapeBibtex("x^2")).toBe("x\\textasciicircum{}2");
    expect(escapeBibtex("a\\b")).toBe("a\\textbackslash{}b");
  });

  it("does not escape its own escapes twice", () => {
    expect(escapeBibtex("\\{")).toBe("\\textbackslash{}\\{");
  });

  it("keeps letters outside ASCII and turns control characters into single spaces", () => {
    expect(escapeBibtex("Müller\nand  Ørsted\t")).toBe("Müller and Ørsted");
  });
});

describe("citeKey", () => {
  it("keeps slug letters and digits and adds the version", () => {
    expect(citeKey("rp-7f3k2q", 3)).toBe("restpoint-rp-7f3k2q-v3");
  });
  it("replaces characters a cite key cannot hold", () => {
    expect(citeKey("a b,c}", 1)).toBe("restpoint-a-b-c-v1");
    expect(citeKey("%%", 1)).toBe("restpoint-model-v1");
  });
});

describe("toBibtex", () => {
  it("writes a complete @misc entry with the hash and the manuscript DOI", () => {
    expect(toBibtex(base)).toBe(
      [
        "@misc{restpoint-rp-7f3k2q-v2,",
        "  title = {{Heron foraging at the estuary}},",
        "  author = {Ada Marsh and Tomas Reed},",
        "  year = {2026},",
        "  howpublished = {Restpoint model registry},",
        "  version = {2},",
        "  url = {https://restpoint.example/models/rp-7f3k2q/v/2},",
        `  note = {Model version 2, specification SHA-256 ${HASH}. Accompanies https://doi.org/10.1234/abc\\_def.5}`,
        "}",
        "",
      ].join("\n"),
    );
  });

  it("escapes a hostile title so the entry stays balanced", () => {
    const out = toBibtex({ ...base, title: "Costs } & 100% of {benefit} #2 \\end" });
    expect(out).toContain("title = {{Costs \\} \\& 100\\% of \\{benefit\\} \\#2 \\textbackslash{}end}}");
    // Unescaped braces must balance over the whole entry.
    const unescaped = out.replace(/\\[{}]/g, "");
    const opens = (unescaped.match(/{/g) ?? []).length;
    const closes = (unescaped.match(/}/g) ?? []).length;
    expect(opens).toBe(closes);
  });

  it("braces an author name that contains 'and' or a comma so it stays one author", () => {
    const out = toBibtex({ ...base, authors: [{ name: "Reef and Kelp Lab" }, { name: "Smith, J." }, { name: "Ana Ruiz" }] });
    expect(out).toContain("author = {{Reef and Kelp Lab} and {Smith, J.} and Ana Ruiz}");
  });

  it("leaves out the author field when there is none and the DOI sentence when there is no DOI", () => {
    const out = toBibtex({ ...base, authors: [], manuscript: undefined });
    expect(out).not.toContain("author =");
    expect(out).toContain(`note = {Model version 2, specification SHA-256 ${HASH}}`);
  });

  it("drops braces from the URL so the verbatim field cannot close early", () => {
    expect(toBibtex({ ...base, url: "https://x.example/{a}" })).toContain("url = {https://x.example/a}");
  });
});

describe("toPlainText", () => {
  it("writes authors, year, title, version, URL, hash and manuscript", () => {
    expect(toPlainText(base)).toBe(
      "Ada Marsh and Tomas Reed (2026). Heron foraging at the estuary. Model version 2, Restpoint model registry. " +
        `https://restpoint.example/models/rp-7f3k2q/v/2 Specification SHA-256: ${HASH}. ` +
        "Accompanies: Shared nests, https://doi.org/10.1234/abc_def.5.\n",
    );
  });

  it("joins three authors with commas and a final 'and', and keeps a title's own full stop", () => {
    const out = toPlainText({
      ...base,
      title: "Who wins?",
      authors: [{ name: "A" }, { name: "B" }, { name: "C" }],
      manuscript: undefined,
    });
    expect(out.startsWith("A, B and C (2026). Who wins? Model version 2")).toBe(true);
    expect(out).not.toContain("Accompanies");
  });

  it("starts with the year alone when there are no authors and flattens line breaks", () => {
    expect(toPlainText({ ...base, authors: [], title: "Two\nlines" }).startsWith("(2026). Two lines.")).toBe(true);
  });
});
