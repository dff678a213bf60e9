/**
 * Citations of one registered model version, as BibTeX and as a plain-text line.
 * Pure: takes the version's public facts and returns strings; carries the spec's SHA-256 so
 * that a reader can tell exactly which specification was cited.
 */

export interface CitationInput {
  slug: string;
  versionNumber: number;
  /** The version's title (from its spec). */
  title: string;
  authors: { name: string }[];
  /** When the version was registered. */
  registeredAt: Date;
  specSha256: string;
  /** Absolute URL of the version's public page. */
  url: string;
  manuscript?: { title?: string | null; doi?: string | null; year?: number | null };
}

/**
 * Escapes the characters TeX treats as special so that titles such as "Cost & benefit, 50%"
 * come out as typed. Backslash first, so the escapes added later are not escaped again.
 */
export function escapeBibtex(text: string): string {
  let out = "";
  for (const ch of text) {
    switch (ch) {
      case "\\":
        out += "\\textbackslash{}";
        break;
      case "{":
      case "}":
      case "&":
      case "%":
      case "$":
      case "#":
      case "_":
        out += `\\${ch}`;
        break;
      case "~":
        out += "\\textasciitilde{}";
        break;
      case "^":
        out += "\\textasciicircum{}";
        break;
      default:
        // Control characters (including newlines) would break the entry: a space instead.
        out += /[\u0000-\u001f\u007f]/.test(ch) ? " " : ch;
    }
  }
  return out.replace(/ {2,}/g, " ").trim();
}

/** A name that itself contains " and " would split into two authors in BibTeX: brace it as one. */
function bibtexAuthor(name: string): string {
  const escaped = escapeBibtex(name);
  return /\sand\s/i.test(name) || name.includes(",") ? `{${escaped}}` : escaped;
}

/** Cite keys allow letters, digits and a few marks; everything else becomes a hyphen. */
export function citeKey(slug: string, versionNumber: number): string {
  const safe = slug.replace(/[^A-Za-z0-9-]+/g, "-").replace(/^-+|-+$/g, "");
  return `restpoint-${safe || "model"}-v${versionNumber}`;
}

/** DOIs and URLs go into verbatim fields; only braces would unbalance the entry, so they are dropped. */
function verbatim(value: string): string {
  return value.replace(/[{}\u0000-\u001f\u007f]/g, "");
}

export function toBibtex(c: CitationInput): string {
  const fields: [string, string][] = [
    ["title", `{${escapeBibtex(c.title)}}`],
  ];
  if (c.authors.length > 0) fields.push(["author", c.authors.map((a) => bibtexAuthor(a.name)).join(" and ")]);
  fields.push(
    ["year", String(c.registeredAt.getUTCFullYear())],
    ["howpublished", "Restpoint model registry"],
    ["version", String(c.versionNumber)],
    ["url", verbatim(c.url)],
  );
  const doi = c.manuscript?.doi;
  // note is ordinary text in every BibTeX style, so the DOI is escaped there, not taken verbatim.
  const accompanies = doi ? `. Accompanies https://doi.org/${escapeBibtex(doi)}` : "";
  fields.push(["note", `Model version ${c.versionNumber}, specification SHA-256 ${escapeBibtex(c.specSha256)}${accompanies}`]);
  const body = fields.map(([k, v]) => `  ${k} = {${v}}`).join(",\n");
  return `@misc{${citeKey(c.slug, c.versionNumber)},\n${body}\n}\n`;
}

function oneLine(text: string): string {
  return text.replace(/[\u0000-\u001f\u007f]+/g, " ").replace(/ {2,}/g, " ").trim();
}

/** "A, B and C" for the plain-text citation. */
function joinNames(names: string[]): string {
  if (names.length <= 1) return names.join("");
  return `${names.slice(0, -1).join(", ")} and ${names[names.length - 1] ?? ""}`;
}

export function toPlainText(c: CitationInput): string {
  const names = joinNames(c.authors.map((a) => oneLine(a.name)));
  const year = c.registeredAt.getUTCFullYear();
  const head = names ? `${names} (${year}).` : `(${year}).`;
  const title = oneLine(c.title);
  const parts = [
    `${head} ${title}${/[.?!]$/.test(title) ? "" : "."} Model version ${c.versionNumber}, Restpoint model registry.`,
    oneLine(c.url),
    `Specification SHA-256: ${oneLine(c.specSha256)}.`,
  ];
  const m = c.manuscript;
  if (m?.doi) {
    const about = m.title ? `${oneLine(m.title)}, ` : "";
    parts.push(`Accompanies: ${about}https://doi.org/${oneLine(m.doi)}.`);
  }
  return `${parts.join(" ")}\n`;
}
