import type { ReactNode } from "react";

/** The title block of a page: an optional small overline, the title, a lede and actions. */
export function PageHeader({ overline, title, lede, actions }: { overline?: string; title: string; lede?: ReactNode; actions?: ReactNode }) {
  return (
    <header className="flex flex-col gap-3 border-b border-line pb-6 sm:flex-row sm:items-end sm:justify-between">
      <div className="flex max-w-3xl flex-col gap-2">
        {overline === undefined ? null : <p className="text-sm font-semibold tracking-wide text-ochre">{overline}</p>}
        <h1 className="text-3xl font-bold tracking-tight text-ink">{title}</h1>
        {lede === undefined ? null : <div className="text-base text-ink-soft">{lede}</div>}
      </div>
      {actions === undefined ? null : <div className="flex shrink-0 flex-wrap gap-2">{actions}</div>}
    </header>
  );
}

/** A section with a heading inside a page. */
export function Section({ title, description, children, id }: { title: string; description?: ReactNode; children: ReactNode; id?: string }) {
  return (
    <section className="flex flex-col gap-4" aria-labelledby={id}>
      <div className="flex flex-col gap-1">
        <h2 id={id} className="text-xl font-semibold text-ink">
          {title}
        </h2>
        {description === undefined ? null : <div className="text-sm text-ink-soft">{description}</div>}
      </div>
      {children}
    </section>
  );
}
