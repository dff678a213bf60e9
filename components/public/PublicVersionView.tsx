/**
 * The public page of one model version: what the model is, the game and its dynamics, the
 * server's re-run (verdict, every claim, rest points, figures), the reader's own re-run, and
 * downloads with the citation. Every user-supplied string is rendered as text.
 */
import Link from "next/link";
import { BadgeSnippets } from "@/components/badge/BadgeSnippets";
import { CopyButton } from "@/components/badge/CopyButton";
import { ReportView } from "@/components/report";
import { VerdictTag } from "@/components/status/VerdictTag";
import { Notice } from "@/components/ui/Notice";
import { toBibtex, toPlainText } from "@/lib/citation";
import { citationOf, reportApiPath, versionPath, type PublicVersion } from "@/lib/registry";
import { dynamicsView, payoffTable } from "@/lib/spec-view";
import { DynamicsPanel } from "./DynamicsPanel";
import { dynamicsLabel } from "./labels";
import { PayoffTable } from "./PayoffTable";
import { plotGameOf } from "./plot-game";
import { RegisteredFigures } from "./RegisteredFigures";
import { tryLede } from "./claim-changes";
import { TryYourOwnValues } from "./TryYourOwnValues";

const dateFormat = new Intl.DateTimeFormat("en-GB", { day: "numeric", month: "long", year: "numeric", timeZone: "UTC" });

function Block({ id, title, children, lede }: { id: string; title: string; lede?: React.ReactNode; children: React.ReactNode }) {
  return (
    <section aria-labelledby={id} className="flex min-w-0 flex-col gap-4">
      <div className="flex flex-col gap-1 border-b border-line pb-2">
        <h2 id={id} className="text-xl font-semibold">
          {title}
        </h2>
        {lede === undefined ? null : <div className="text-sm text-ink-soft">{lede}</div>}
      </div>
      {children}
    </section>
  );
}

function formatSize(bytes: number): string {
  if (bytes >= 1024 * 1024) return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
  if (bytes >= 1024) return `${Math.round(bytes / 1024)} KB`;
  return `${bytes} bytes`;
}

/** Only http(s) links from user data become anchors. */
function safeHref(url: string | null): string | null {
  if (url === null) return null;
  try {
    const u = new URL(url);
    return u.protocol === "https:" || u.protocol === "http:" ? u.toString() : null;
  } catch {
    return null;
  }
}

/** `modelPage`: shown at the model's own address (its newest version), which embeds the model badge. */
export function PublicVersionView({ data, modelPage }: { data: PublicVersion; modelPage: boolean }) {
  const { model, version, readable, report } = data;
  const base = versionPath(model.slug, version.number);
  const citation = citationOf(data);
  const plainCitation = toPlainText(citation).trim();
  const bibtex = toBibtex(citation);
  const manuscriptHref = safeHref(model.url);
  const game = readable?.game;
  const spec = readable?.spec;
  const experiments = spec?.experiments ?? [];
  const older = model.versions.length;
  return (
    <article className="flex flex-col gap-10" data-testid="public-version" data-slug={model.slug} data-version={version.number}>
      <header className="flex flex-col gap-3 border-b border-line pb-6">
        <p className="text-xs font-semibold uppercase tracking-[0.12em] text-ochre">
          <Link href="/models" className="hover:underline">
            Registry
          </Link>{" "}
          · <span className="normal-case">{model.slug}</span> · version {version.number}
          {data.latest ? " (newest)" : ` of ${older}`}
        </p>
        <h1 className="text-3xl font-bold tracking-tight break-words">{version.title}</h1>
        {model.authors.length > 0 && (
          <ul className="flex flex-wrap gap-x-4 gap-y-1 text-base text-ink-soft" aria-label="Authors">
            {model.authors.map((a, i) => (
              <li key={i}>
                {a.name}
                {a.orcid !== null && (
                  <a href={`https://orcid.org/${encodeURIComponent(a.orcid)}`} className="ml-1 font-mono text-xs text-tide hover:underline" rel="noopener noreferrer">
                    ORCID {a.orcid}
                  </a>
                )}
                {a.affiliation !== null && <span className="text-sm text-ink-faint"> ({a.affiliation})</span>}
              </li>
            ))}
          </ul>
        )}
        <div className="flex flex-wrap items-center gap-3 text-sm">
          {report === null ? (
            <span className="rounded-full border border-line px-2 py-0.5 text-xs text-ink-soft">Awaiting re-run</span>
          ) : (
            <VerdictTag verdict={report.verdict} size="lg" />
          )}
          <span className="text-ink-soft">Registered {dateFormat.format(new Date(version.createdAt))}</span>
          <span className="text-ink-soft">Dynamics: {dynamicsLabel(version.dynamicsKind)}</span>
        </div>
        {!data.latest && (
          <Notice title="An older version">
            This is version {version.number}. The newest is{" "}
            <Link className="font-semibold text-tide hover:underline" href={`/models/${encodeURIComponent(model.slug)}`}>
              version {model.versions[0]?.number}
            </Link>
            .
          </Notice>
        )}
      </header>

      <div className="grid gap-10 lg:grid-cols-[minmax(0,1fr)_18rem]">
        <div className="flex min-w-0 flex-col gap-10">
          {(model.summary !== "" || spec?.summary !== undefined) && (
            <Block id="about" title="About this model">
              <p className="max-w-3xl whitespace-pre-line break-words">{model.summary !== "" ? model.summary : spec?.summary}</p>
            </Block>
          )}

          {game !== undefined && spec !== undefined ? (
            <Block id="game" title="The game" lede="Payoffs with every expression evaluated at the model's parameter values.">
              <PayoffTable view={payoffTable(spec)} />
              <h3 className="text-base font-semibold">Dynamics</h3>
              <DynamicsPanel view={dynamicsView(spec.dynamics, game)} />
            </Block>
          ) : (
            <Notice tone="error" title="The game cannot be shown">
              This version&apos;s specification does not describe a game that can be drawn; the report below lists its problems.
            </Notice>
          )}

          <Block id="rerun" title="The server's re-run" lede="Computed by Restpoint from this exact specification; the figures are drawn from that stored run.">
            {report === null ? (
              <Notice title="Not re-run yet">The server has not finished re-running this version. Its report appears here when it has.</Notice>
            ) : (
              <ReportView
                report={report}
                game={game}
                specClaims={spec?.claims}
                figures={
                  game === undefined ? undefined : (
                    <RegisteredFigures reportUrl={reportApiPath(model.slug, version.number)} game={plotGameOf(game)} />
                  )
                }
              />
            )}
          </Block>

          {game !== undefined && spec !== undefined && report?.verdict !== "invalid" && (
            <Block
              id="try"
              title="Try your own values"
              lede={tryLede(spec)}
            >
              <TryYourOwnValues specText={data.specText} registeredClaims={report?.claims} />
            </Block>
          )}
        </div>

        <aside className="flex min-w-0 flex-col gap-8 lg:sticky lg:top-6 lg:self-start" aria-label="Manuscript, versions and downloads">
          {(model.doi !== null || model.manuscriptTitle !== null || manuscriptHref !== null) && (
            <section aria-labelledby="manuscript" className="flex flex-col gap-2 text-sm">
              <h2 id="manuscript" className="text-base font-semibold">
                Manuscript
              </h2>
              {model.manuscriptTitle !== null && <p className="break-words">{model.manuscriptTitle}</p>}
              {model.year !== null && <p className="text-ink-soft">{model.year}</p>}
              {model.doi !== null && (
                <p>
                  DOI{" "}
                  <a className="font-mono break-all text-tide hover:underline" href={`https://doi.org/${model.doi}`} rel="noopener noreferrer">
                    {model.doi}
                  </a>
                </p>
              )}
              {manuscriptHref !== null && (
                <p>
                  <a className="break-all text-tide hover:underline" href={manuscriptHref} rel="noopener noreferrer nofollow ugc">
                    Read the manuscript
                  </a>
                </p>
              )}
            </section>
          )}

          <section aria-labelledby="versions" className="flex flex-col gap-2 text-sm">
            <h2 id="versions" className="text-base font-semibold">
              Versions
            </h2>
            <ol className="flex flex-col gap-1.5">
              {model.versions.map((v) => (
                <li key={v.id} className="flex flex-wrap items-center gap-2">
                  {v.id === version.id ? (
                    <span className="font-semibold" aria-current="page">
                      Version {v.number}
                    </span>
                  ) : (
                    <Link className="text-tide hover:underline" href={versionPath(model.slug, v.number)}>
                      Version {v.number}
                    </Link>
                  )}
                  {v.verdict === null ? <span className="text-xs text-ink-faint">awaiting re-run</span> : <VerdictTag verdict={v.verdict} size="sm" />}
                </li>
              ))}
            </ol>
          </section>

          <section aria-labelledby="downloads" className="flex flex-col gap-2 text-sm">
            <h2 id="downloads" className="text-base font-semibold">
              Downloads
            </h2>
            <ul className="flex flex-col gap-1.5" data-testid="downloads">
              <li>
                <a className="text-tide hover:underline" href={`${base}/spec.json`} download>
                  Specification (JSON)
                </a>
              </li>
              {report !== null && (
                <li>
                  <a className="text-tide hover:underline" href={`${base}/report.json`} download>
                    Report (JSON)
                  </a>
                </li>
              )}
              {report?.experiments.map((e) => (
                <li key={e.id}>
                  <a className="text-tide hover:underline break-all" href={`${base}/experiments/${encodeURIComponent(e.id)}.csv`} download data-testid={`csv-${e.id}`}>
                    Run <q>{e.id}</q> (CSV)
                  </a>
                </li>
              ))}
              {report === null &&
                experiments.length > 0 && <li className="text-ink-faint">Run data (CSV) once the re-run has finished.</li>}
              {data.supplements.map((f) => (
                <li key={f.id}>
                  <a className="text-tide hover:underline break-all" href={`/api/v1/files/${encodeURIComponent(f.id)}`} download>
                    {f.originalName}
                  </a>{" "}
                  <span className="text-xs text-ink-faint">(supplement, {formatSize(f.size)})</span>
                </li>
              ))}
              <li>
                <a className="text-tide hover:underline" href={`${base}/citation.bib`} download data-testid="bibtex-link">
                  Citation (BibTeX)
                </a>
              </li>
              <li>
                <a className="text-tide hover:underline" href={`${base}/citation.txt`} download>
                  Citation (plain text)
                </a>
              </li>
            </ul>
          </section>

          <section aria-labelledby="cite" className="flex flex-col gap-2 text-sm">
            <h2 id="cite" className="text-base font-semibold">
              Cite this version
            </h2>
            <p className="break-words" data-testid="citation-text">
              {plainCitation}
            </p>
            <div className="flex flex-wrap gap-2">
              <CopyButton text={plainCitation} label="Copy citation" />
              <CopyButton text={bibtex} label="Copy BibTeX" />
            </div>
            <details>
              <summary className="cursor-pointer font-medium text-tide">BibTeX</summary>
              <pre role="region" aria-label="BibTeX entry" tabIndex={0} className="mt-2 overflow-x-auto rounded-lg border border-line bg-sunken p-3 font-mono text-2xs">{bibtex}</pre>
            </details>
            <p className="font-mono text-2xs break-all text-ink-faint">SHA-256 {version.specSha256}</p>
          </section>

          <div className="min-w-0 text-sm">
            <BadgeSnippets slug={model.slug} number={modelPage ? undefined : version.number} isPublic revision={report?.verdict ?? "pending"} />
          </div>
        </aside>
      </div>
    </article>
  );
}
