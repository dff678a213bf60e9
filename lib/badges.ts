/**
 * Badges as SVG text: a rounded hexagon emblem that carries the verdict as a glyph, beside
 * two lines of text on a card with cut corners. Pure functions of the facts given, so the
 * same facts always give the same bytes (the routes hash them for their ETag).
 *
 * A badge states only what was checked: how many claims the engine re-ran and what came
 * out, the editor's recorded decision, the version and the first 8 hex digits of the spec's
 * SHA-256. It never claims the model or paper is correct.
 */
import { createHash } from "node:crypto";
import type { DecisionOutcome } from "@/db/schema";
import type { Verdict } from "@/lib/engine/types";

export interface ClaimCounts {
  confirmed: number;
  contradicted: number;
  inconclusive: number;
}

/** What a version badge shows. `verdict` null: the engine has not finished with it yet. */
export interface VersionBadgeFacts {
  slug: string;
  number: number;
  specSha256: string;
  verdict: Verdict | null;
  counts: ClaimCounts | null;
  decision: DecisionOutcome | null;
  /** Named in the text alternative only (the visible text stays short). */
  venueName?: string | null;
}

/** A model badge shows its latest decided version, or says that none is decided yet. */
export interface ModelBadgeFacts {
  slug: string;
  latestDecided: Omit<VersionBadgeFacts, "slug"> | null;
}

// Our own palette: dark enough on the light card for WCAG AA at 10-12 px (contrast >= 4.5:1).
export const VERDICT_COLOURS: Record<Verdict | "pending", string> = {
  confirmed: "#17705a",
  contradicted: "#b3261e",
  inconclusive: "#8a5a00",
  invalid: "#5e4f73",
  pending: "#56616a",
};
const DECISION_COLOURS: Record<DecisionOutcome | "none", string> = {
  verified: "#17705a",
  "changes-requested": "#8a5a00",
  declined: "#b3261e",
  none: "#56616a",
};
const CARD = "#fcfbf8";
const INK = "#34312c";

export const DECISION_WORDS: Record<DecisionOutcome, string> = {
  verified: "verified",
  "changes-requested": "changes requested",
  declined: "declined",
};

/** The bold line: what the engine found, in numbers. */
export function verdictStatement(verdict: Verdict | null, counts: ClaimCounts | null): string {
  const c = counts ?? { confirmed: 0, contradicted: 0, inconclusive: 0 };
  const total = c.confirmed + c.contradicted + c.inconclusive;
  const of = (k: number, word: string) => `${k} of ${total} claim${total === 1 ? "" : "s"} ${word}`;
  switch (verdict) {
    case null:
      return "not yet checked";
    case "invalid":
      return "spec invalid, not run";
    case "confirmed":
      return total === 1 ? "1 claim confirmed" : `all ${total} claims confirmed`;
    case "contradicted":
      return of(c.contradicted, "contradicted");
    case "inconclusive":
      return of(c.inconclusive, "inconclusive");
  }
}

export function escapeXml(s: string): string {
  return s.replace(/[<>&"']/g, (ch) => {
    switch (ch) {
      case "<":
        return "&lt;";
      case ">":
        return "&gt;";
      case "&":
        return "&amp;";
      case '"':
        return "&quot;";
      default:
        return "&apos;";
    }
  });
}

/** Removes characters XML 1.0 forbids (control characters), which escaping cannot make legal. */
function xmlSafe(s: string): string {
  // eslint-disable-next-line no-control-regex
  return escapeXml(s.replace(/[\u0000-\u0008\u000B\u000C\u000E-\u001F\uFFFE\uFFFF]/g, ""));
}

/**
 * Approximate advance width of a string in a sans-serif face, in em (common practice for
 * badges rendered without font metrics). The SVG sets `textLength` to this, so the text fills
 * exactly the space measured whichever font the viewer has.
 */
export function textWidth(s: string, sizePx: number, bold = false): number {
  let em = 0;
  for (const ch of s) {
    if ("iljtf.,:;'|!()[] ".includes(ch)) em += 0.32;
    else if ("mwMW".includes(ch)) em += 0.86;
    else if (ch >= "A" && ch <= "Z") em += 0.68;
    else if (ch >= "0" && ch <= "9") em += 0.6;
    else if (ch === "r") em += 0.42;
    else if (ch === "·" || ch === "-") em += 0.38;
    else em += 0.57;
  }
  return Math.ceil(em * sizePx * (bold ? 1.07 : 1));
}

function glyph(verdict: Verdict | null): string {
  const s = `fill="none" stroke="${CARD}" stroke-width="2.4" stroke-linecap="round" stroke-linejoin="round"`;
  switch (verdict) {
    case "confirmed":
      return `<path d="M-5 0.5 L-1.6 4 L5.2 -4" ${s}/>`;
    case "contradicted":
      return `<path d="M-4 -4 L4 4 M4 -4 L-4 4" ${s}/>`;
    case "inconclusive":
      return `<path d="M-3.6 -2.6 C-3.6 -7 3.6 -7 3.6 -2.6 C3.6 0.2 0 0 0 2.4" ${s}/><circle cx="0" cy="5.6" r="1.4" fill="${CARD}"/>`;
    case "invalid":
      return `<path d="M0 -5 V1" ${s}/><circle cx="0" cy="4.6" r="1.4" fill="${CARD}"/>`;
    case null:
      return [-4.5, 0, 4.5].map((x) => `<circle cx="${x}" cy="0" r="1.5" fill="${CARD}"/>`).join("");
  }
}

/** A hexagon with its corners rounded by quadratic curves, centred on (0, 0). */
function roundedHexagon(r: number, round: number): string {
  const pts = Array.from({ length: 6 }, (_, k) => {
    const a = (Math.PI / 3) * k - Math.PI / 2; // pointy top
    return [r * Math.cos(a), r * Math.sin(a)] as const;
  });
  const f = (n: number) => Number(n.toFixed(2)).toString();
  const parts: string[] = [];
  for (let k = 0; k < 6; k++) {
    const p = pts[k] ?? [0, 0];
    const prev = pts[(k + 5) % 6] ?? [0, 0];
    const next = pts[(k + 1) % 6] ?? [0, 0];
    const t = round / r;
    const a: [number, number] = [p[0] + (prev[0] - p[0]) * t, p[1] + (prev[1] - p[1]) * t];
    const b: [number, number] = [p[0] + (next[0] - p[0]) * t, p[1] + (next[1] - p[1]) * t];
    parts.push(`${k === 0 ? "M" : "L"}${f(a[0])} ${f(a[1])} Q${f(p[0])} ${f(p[1])} ${f(b[0])} ${f(b[1])}`);
  }
  return parts.join(" ") + " Z";
}

interface Layout {
  title: string;
  verdict: Verdict | null;
  headline: string;
  /** The small second line: plain part, then a decision part in its own colour. */
  detail: string;
  decisionWord: string;
  decisionColour: string;
}

const HEIGHT = 40;
const HEAD_PX = 12.5;
const DETAIL_PX = 10.5;

function render(l: Layout): string {
  const colour = l.verdict === null ? VERDICT_COLOURS.pending : VERDICT_COLOURS[l.verdict];
  const headW = textWidth(l.headline, HEAD_PX, true);
  const detailPlainW = textWidth(l.detail, DETAIL_PX);
  const decisionW = textWidth(l.decisionWord, DETAIL_PX, true);
  const gap = 4;
  const textX = 42;
  const width = textX + Math.max(headW, detailPlainW + gap + decisionW) + 14;
  const cut = 7;
  const card = `M${cut} 1 H${width - cut} L${width - 1} ${cut} V${HEIGHT - cut} L${width - cut} ${HEIGHT - 1} H${cut} L1 ${HEIGHT - cut} V${cut} Z`;
  const font = `font-family="'DejaVu Sans','Segoe UI',Verdana,Helvetica,Arial,sans-serif"`;
  return [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${HEIGHT}" viewBox="0 0 ${width} ${HEIGHT}" role="img" aria-labelledby="rp-badge-title">`,
    `<title id="rp-badge-title">${xmlSafe(l.title)}</title>`,
    `<path d="${card}" fill="${CARD}" stroke="${colour}" stroke-width="1.5"/>`,
    `<g transform="translate(21 20)"><path d="${roundedHexagon(14.5, 3.5)}" fill="${colour}"/>${glyph(l.verdict)}</g>`,
    `<g ${font}>`,
    `<text x="${textX}" y="17" font-size="${HEAD_PX}" font-weight="700" fill="${colour}" textLength="${headW}" lengthAdjust="spacingAndGlyphs">${xmlSafe(l.headline)}</text>`,
    `<text x="${textX}" y="31.5" font-size="${DETAIL_PX}" fill="${INK}" textLength="${detailPlainW}" lengthAdjust="spacingAndGlyphs">${xmlSafe(l.detail)}</text>`,
    `<text x="${textX + detailPlainW + gap}" y="31.5" font-size="${DETAIL_PX}" font-weight="700" fill="${l.decisionColour}" textLength="${decisionW}" lengthAdjust="spacingAndGlyphs">${xmlSafe(l.decisionWord)}</text>`,
    `</g>`,
    `</svg>`,
  ].join("");
}

function decisionSentence(decision: DecisionOutcome | null, venueName: string | null | undefined): string {
  if (decision === null) return "no editor decision recorded";
  const at = venueName ? ` at ${venueName}` : "";
  return `editor decision${at}: ${DECISION_WORDS[decision]}`;
}

function checkedSentence(verdict: Verdict | null, counts: ClaimCounts | null): string {
  if (verdict === null) return "the Restpoint engine has not finished re-running its claims";
  if (verdict === "invalid") return "the spec failed validation, so no claim was re-run";
  return `${verdictStatement(verdict, counts)} when the Restpoint engine re-ran them`;
}

/** Version badge: immutable once the version has its report and decision. */
export function versionBadgeSvg(f: VersionBadgeFacts): string {
  const sha8 = f.specSha256.slice(0, 8).toLowerCase();
  return render({
    title: `Restpoint, model ${f.slug} version ${f.number} (spec SHA-256 ${sha8}…): ${checkedSentence(f.verdict, f.counts)}; ${decisionSentence(f.decision, f.venueName)}.`,
    verdict: f.verdict,
    headline: verdictStatement(f.verdict, f.counts),
    detail: `v${f.number} · ${sha8} ·`,
    decisionWord: f.decision === null ? "no decision" : DECISION_WORDS[f.decision],
    decisionColour: DECISION_COLOURS[f.decision ?? "none"],
  });
}

/** Model badge: the facts of its latest decided version. */
export function modelBadgeSvg(f: ModelBadgeFacts): string {
  const v = f.latestDecided;
  if (v === null) {
    return render({
      title: `Restpoint, model ${f.slug}: no version has an editor decision yet.`,
      verdict: null,
      headline: "no decided version yet",
      detail: `${f.slug} ·`,
      decisionWord: "awaiting editor",
      decisionColour: DECISION_COLOURS.none,
    });
  }
  const sha8 = v.specSha256.slice(0, 8).toLowerCase();
  return render({
    title: `Restpoint, model ${f.slug}, latest decided version ${v.number} (spec SHA-256 ${sha8}…): ${checkedSentence(v.verdict, v.counts)}; ${decisionSentence(v.decision, v.venueName)}.`,
    verdict: v.verdict,
    headline: verdictStatement(v.verdict, v.counts),
    detail: `${f.slug} v${v.number} ·`,
    decisionWord: v.decision === null ? "no decision" : DECISION_WORDS[v.decision],
    decisionColour: DECISION_COLOURS[v.decision ?? "none"],
  });
}

/** A strong ETag over the exact bytes. */
export function badgeEtag(svg: string): string {
  return `"${createHash("sha256").update(svg).digest("hex").slice(0, 32)}"`;
}
