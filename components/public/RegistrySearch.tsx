/**
 * The registry's search form: a plain GET form, so it works without JavaScript and every
 * search has a URL a reader can share. Field names are the registry query's (lib/registry.ts).
 */
import { DYNAMICS_KINDS, VERDICT_FILTERS, type RegistryQuery } from "@/lib/registry";
import { buttonClass } from "@/components/ui/Button";
import { DYNAMICS_LABELS, VERDICT_FILTER_LABELS } from "./labels";

function TextInput({ name, label, value, placeholder }: { name: string; label: string; value?: string; placeholder?: string }) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={`rq-${name}`} className="text-xs font-semibold text-ink-soft">
        {label}
      </label>
      <input id={`rq-${name}`} name={name} defaultValue={value ?? ""} placeholder={placeholder} maxLength={200} className="rp-input" />
    </div>
  );
}

function Select({ name, label, value, options }: { name: string; label: string; value?: string; options: [string, string][] }) {
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={`rq-${name}`} className="text-xs font-semibold text-ink-soft">
        {label}
      </label>
      <select id={`rq-${name}`} name={name} defaultValue={value ?? ""} className="rp-input">
        {options.map(([v, l]) => (
          <option key={v} value={v}>
            {l}
          </option>
        ))}
      </select>
    </div>
  );
}

export function RegistrySearch({ query }: { query: Partial<RegistryQuery> }) {
  const advanced = query.title !== undefined || query.author !== undefined || query.doi !== undefined || query.strategy !== undefined;
  return (
    <form method="get" action="/models" role="search" aria-label="Search the registry" className="rp-card flex flex-col gap-4 p-4 sm:p-5">
      <div className="flex flex-col gap-2 sm:flex-row sm:items-end">
        <div className="flex flex-1 flex-col gap-1">
          <label htmlFor="rq-q" className="text-sm font-semibold">
            Search models
          </label>
          <input
            id="rq-q"
            name="q"
            type="search"
            defaultValue={query.q ?? ""}
            maxLength={200}
            placeholder="Title, author, DOI or strategy name"
            className="rp-input"
          />
        </div>
        <button type="submit" className={buttonClass("primary", "sm:w-auto")}>
          Search
        </button>
      </div>
      <div className="grid gap-3 sm:grid-cols-3">
        <Select
          name="dynamics"
          label="Dynamics"
          value={query.dynamics}
          options={[["", "Any dynamics"], ...DYNAMICS_KINDS.map((k): [string, string] => [k, DYNAMICS_LABELS[k] ?? k])]}
        />
        <Select
          name="verdict"
          label="Verdict of the newest version"
          value={query.verdict}
          options={[["", "Any verdict"], ...VERDICT_FILTERS.map((k): [string, string] => [k, VERDICT_FILTER_LABELS[k] ?? k])]}
        />
        <Select
          name="sort"
          label="Order"
          value={query.sort}
          options={[
            ["recent", "Newest versions first"],
            ["title", "By title"],
          ]}
        />
      </div>
      <details open={advanced} className="group">
        <summary className="cursor-pointer text-sm font-medium text-tide">Search one field only</summary>
        <div className="mt-3 grid gap-3 sm:grid-cols-2 lg:grid-cols-4">
          <TextInput name="title" label="Title" value={query.title} />
          <TextInput name="author" label="Author" value={query.author} />
          <TextInput name="doi" label="DOI" value={query.doi} placeholder="10.1234/…" />
          <TextInput name="strategy" label="Strategy name" value={query.strategy} />
        </div>
      </details>
    </form>
  );
}
