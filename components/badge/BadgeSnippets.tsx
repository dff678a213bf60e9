/**
 * The badge of a version (or of a model, without `number`) with Markdown and HTML snippets
 * to embed it elsewhere. Server component: place it on any version or model page.
 *
 *   <BadgeSnippets slug="rp-7f3k2q" number={3} isPublic={model.visibility === "public"} />
 *   <BadgeSnippets slug="rp-7f3k2q" isPublic />            // the model's badge
 */
import { env } from "@/lib/env";
import { CopyButton } from "./CopyButton";

export interface BadgeSnippetsProps {
  slug: string;
  /** A version number for that version's badge; omitted for the model's badge. */
  number?: number;
  /** A private model's badge is served only to its owner and editors: say so. */
  isPublic: boolean;
  /** Absolute origin of the links; defaults to the server's configured address. */
  origin?: string;
  /**
   * Changes whenever what the badge shows may have changed (a decision id, a verdict), so the
   * preview on this page reloads after a client-side navigation instead of reusing the image.
   */
  revision?: string;
}

export function badgeUrls(slug: string, number: number | undefined, origin: string) {
  const base = origin.replace(/\/$/, "");
  const s = encodeURIComponent(slug);
  return number === undefined
    ? { image: `${base}/badges/models/${s}.svg`, page: `${base}/models/${s}`, alt: `Restpoint badge of model ${slug}` }
    : { image: `${base}/badges/models/${s}/v/${number}.svg`, page: `${base}/models/${s}/v/${number}`, alt: `Restpoint badge of model ${slug}, version ${number}` };
}

export function badgeSnippets(slug: string, number: number | undefined, origin: string): { markdown: string; html: string } {
  const u = badgeUrls(slug, number, origin);
  const attr = (s: string) => s.replace(/&/g, "&amp;").replace(/"/g, "&quot;").replace(/</g, "&lt;");
  return {
    markdown: `[![${u.alt}](${u.image})](${u.page})`,
    html: `<a href="${attr(u.page)}"><img src="${attr(u.image)}" alt="${attr(u.alt)}" height="40"></a>`,
  };
}

function Snippet({ id, label, text }: { id: string; label: string; text: string }) {
  return (
    <div className="flex flex-col gap-1.5">
      <div className="flex items-center justify-between gap-2">
        <label htmlFor={id} className="text-xs font-semibold uppercase tracking-[0.1em] text-ink-faint">
          {label}
        </label>
        <CopyButton text={text} label={`Copy ${label}`} />
      </div>
      <textarea id={id} readOnly rows={3} value={text} className="rp-input resize-none font-mono text-xs leading-snug break-all" data-testid={`badge-snippet-${id.endsWith("md") ? "markdown" : "html"}`} />
    </div>
  );
}

export function BadgeSnippets({ slug, number, isPublic, origin = env.authUrl, revision }: BadgeSnippetsProps) {
  const u = badgeUrls(slug, number, origin);
  const s = badgeSnippets(slug, number, origin);
  const idBase = `badge-${slug}-${number ?? "model"}`;
  return (
    <section aria-labelledby={`${idBase}-title`} className="rp-card flex flex-col gap-4 p-5" data-testid="badge-snippets">
      <div className="flex flex-col gap-1">
        <h2 id={`${idBase}-title`} className="text-lg font-semibold">
          {number === undefined ? "Badge of this model" : "Badge of this version"}
        </h2>
        <p className="text-sm text-ink-soft">
          {number === undefined
            ? "Shows the latest version an editor decided on: what the re-run found and the decision."
            : "Shows what the re-run of this version found, the editor's decision and the start of its spec's SHA-256. It does not change once decided."}
        </p>
      </div>
      {/* A plain img: the badge is an SVG file served with its own caching headers. */}
      {/* eslint-disable-next-line @next/next/no-img-element */}
      <img
        src={`${u.image.replace(origin.replace(/\/$/, ""), "")}${revision === undefined ? "" : `?r=${encodeURIComponent(revision)}`}`}
        alt={u.alt}
        height={40}
        className="h-10 w-auto self-start"
      />
      {isPublic ? null : (
        <p className="text-sm text-ink-soft">
          The model is private: the badge shows only to you and the venue&apos;s editors until it is public.
        </p>
      )}
      <Snippet id={`${idBase}-md`} label="Markdown" text={s.markdown} />
      <Snippet id={`${idBase}-html`} label="HTML" text={s.html} />
    </section>
  );
}
