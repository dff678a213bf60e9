"use client";
/**
 * The model entry form (new model, and editing one). Validates with the shared schema as the
 * author types and on submit; the server action checks again and its problems land beside
 * the same fields.
 */
import { useState, useTransition } from "react";
import { Button } from "@/components/ui/Button";
import { Field } from "@/components/ui/Field";
import { Notice } from "@/components/ui/Notice";
import { EMPTY_AUTHOR, formErrors, validateModelForm, type FormErrors, type ModelFormValues } from "./model-form";

export type ModelFormResult = { ok: true; message: string } | { ok: false; message: string; problems: { path: string; message: string }[] };

export interface ModelFormProps {
  initial: ModelFormValues;
  venues: readonly { id: string; name: string }[];
  action: (values: ModelFormValues) => Promise<ModelFormResult>;
  submitLabel: string;
}

const MAX_AUTHORS = 100;

export function ModelForm({ initial, venues, action, submitLabel }: ModelFormProps) {
  const [values, setValues] = useState<ModelFormValues>(initial);
  const [errors, setErrors] = useState<FormErrors>({});
  const [touched, setTouched] = useState(false);
  const [result, setResult] = useState<ModelFormResult | null>(null);
  const [pending, startTransition] = useTransition();

  function update(next: ModelFormValues) {
    setValues(next);
    // After a first submit, re-check as the author corrects fields.
    if (touched) setErrors(validateModelForm(next));
  }
  const set = (k: Exclude<keyof ModelFormValues, "authors" | "visibility">) => (e: React.ChangeEvent<HTMLInputElement | HTMLTextAreaElement | HTMLSelectElement>) =>
    update({ ...values, [k]: e.target.value });
  const setAuthor = (i: number, k: keyof ModelFormValues["authors"][number]) => (e: React.ChangeEvent<HTMLInputElement>) =>
    update({ ...values, authors: values.authors.map((a, j) => (j === i ? { ...a, [k]: e.target.value } : a)) });

  function submit(e: React.FormEvent) {
    e.preventDefault();
    setTouched(true);
    const found = validateModelForm(values);
    setErrors(found);
    setResult(null);
    if (Object.keys(found).length > 0) return;
    startTransition(async () => {
      const r = await action(values);
      setResult(r);
      if (!r.ok) setErrors(formErrors(values, r.problems));
    });
  }

  const err = (pointer: string) => errors[pointer];
  const problemCount = Object.keys(errors).length;

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-6" data-testid="model-form">
      {problemCount > 0 && (
        <Notice tone="error" title={problemCount === 1 ? "One field needs attention." : `${problemCount} fields need attention.`} />
      )}
      {result !== null && result.ok && <Notice tone="success" title={result.message} />}
      {result !== null && !result.ok && problemCount === 0 && <Notice tone="error" title={result.message} />}

      <fieldset className="flex flex-col gap-4">
        <legend className="mb-2 text-lg font-semibold">The model</legend>
        <Field label="Title" name="title" required value={values.title} onChange={set("title")} error={err("/title")} maxLength={300} />
        <div className="flex flex-col gap-1.5">
          <label htmlFor="field-summary" className="text-sm font-semibold text-ink">
            Summary
          </label>
          <textarea
            id="field-summary"
            name="summary"
            rows={4}
            className="rp-input"
            value={values.summary}
            onChange={set("summary")}
            aria-invalid={err("/summary") === undefined ? undefined : true}
            aria-describedby="field-summary-hint"
          />
          <p id="field-summary-hint" className="text-xs text-ink-faint">
            What the model is about, in a few sentences. Up to 5000 characters.
          </p>
          {err("/summary") !== undefined && <p className="text-sm text-danger" role="alert">{err("/summary")}</p>}
        </div>
      </fieldset>

      <fieldset className="flex flex-col gap-4">
        <legend className="mb-2 text-lg font-semibold">The manuscript</legend>
        <Field label="Manuscript title" name="manuscriptTitle" value={values.manuscriptTitle} onChange={set("manuscriptTitle")} error={err("/manuscriptTitle")} />
        <div className="grid gap-4 sm:grid-cols-[2fr_3fr_1fr]">
          <Field label="DOI" name="doi" value={values.doi} onChange={set("doi")} error={err("/doi")} hint="10.NNNN/…; a doi.org link works too." placeholder="10.5555/example" />
          <Field label="Web address" name="url" type="url" value={values.url} onChange={set("url")} error={err("/url")} placeholder="https://" />
          <Field label="Year" name="year" inputMode="numeric" value={values.year} onChange={set("year")} error={err("/year")} />
        </div>
      </fieldset>

      <fieldset className="flex flex-col gap-3" data-testid="authors-fieldset">
        <legend className="mb-2 text-lg font-semibold">Authors</legend>
        <p className="text-xs text-ink-faint">
          ORCID iDs are checked by their check character (ISO 7064 MOD 11-2), so a mistyped digit is caught here.
        </p>
        {values.authors.map((a, i) => (
          <div key={i} className="grid items-start gap-3 rounded-[var(--radius-card)] border border-line p-3 sm:grid-cols-[2fr_2fr_2fr_auto]">
            <Field label={`Author ${i + 1}: name`} name={`authors.${i}.name`} id={`author-${i}-name`} value={a.name} onChange={setAuthor(i, "name")} error={err(`/authors/${i}/name`)} />
            <Field
              label="ORCID iD"
              name={`authors.${i}.orcid`}
              id={`author-${i}-orcid`}
              value={a.orcid}
              onChange={setAuthor(i, "orcid")}
              error={err(`/authors/${i}/orcid`)}
              placeholder="0000-0000-0000-0000"
            />
            <Field label="Affiliation" name={`authors.${i}.affiliation`} id={`author-${i}-affiliation`} value={a.affiliation} onChange={setAuthor(i, "affiliation")} error={err(`/authors/${i}/affiliation`)} />
            {values.authors.length > 1 ? (
              <Button
                type="button"
                kind="quiet"
                className="sm:mt-7"
                onClick={() => update({ ...values, authors: values.authors.filter((_, j) => j !== i) })}
                aria-label={`Remove author ${i + 1}`}
              >
                Remove
              </Button>
            ) : (
              <span aria-hidden="true" />
            )}
          </div>
        ))}
        <div>
          <Button
            type="button"
            kind="secondary"
            onClick={() => update({ ...values, authors: [...values.authors, { ...EMPTY_AUTHOR }] })}
            disabled={values.authors.length >= MAX_AUTHORS}
          >
            Add an author
          </Button>
        </div>
      </fieldset>

      <fieldset className="flex flex-col gap-4">
        <legend className="mb-2 text-lg font-semibold">Where it goes</legend>
        <div className="flex flex-col gap-1.5">
          <label htmlFor="field-venueId" className="text-sm font-semibold text-ink">
            Submitted to
          </label>
          <select id="field-venueId" name="venueId" className="rp-input" value={values.venueId} onChange={set("venueId")} aria-describedby="field-venueId-hint">
            <option value="">No venue yet</option>
            {venues.map((v) => (
              <option key={v.id} value={v.id}>
                {v.name}
              </option>
            ))}
          </select>
          <p id="field-venueId-hint" className="text-xs text-ink-faint">
            The venue&rsquo;s editors can see the model and its versions, even while it is private.
          </p>
          {err("/venueId") !== undefined && <p className="text-sm text-danger" role="alert">{err("/venueId")}</p>}
        </div>
        <div role="radiogroup" aria-labelledby="visibility-label" className="flex flex-col gap-2">
          <span id="visibility-label" className="text-sm font-semibold text-ink">
            Visibility
          </span>
          {(
            [
              ["private", "Private", "Only you, administrators and the venue's editors can see it."],
              ["public", "Public", "Anyone can find it in the registry and re-run its figures."],
            ] as const
          ).map(([value, word, hint]) => (
            <label key={value} className="flex items-start gap-2 text-sm">
              <input
                type="radio"
                name="visibility"
                value={value}
                checked={values.visibility === value}
                onChange={() => update({ ...values, visibility: value })}
                className="mt-1 accent-[var(--rp-tide)]"
              />
              <span>
                <span className="font-semibold">{word}</span> <span className="text-ink-soft">— {hint}</span>
              </span>
            </label>
          ))}
        </div>
      </fieldset>

      <div>
        <Button type="submit" disabled={pending}>
          {pending ? "Saving…" : submitLabel}
        </Button>
      </div>
    </form>
  );
}
