/**
 * The model-entry form's values and their mapping onto the shared input schema
 * (lib/types/deposit.ts), so the browser and the server action validate with the same rules.
 */
import { modelInputSchema, type ModelInput, type ModelView } from "@/lib/types/deposit";

export interface AuthorValues {
  name: string;
  orcid: string;
  affiliation: string;
}

export interface ModelFormValues {
  title: string;
  summary: string;
  manuscriptTitle: string;
  doi: string;
  url: string;
  year: string;
  venueId: string;
  visibility: "private" | "public";
  authors: AuthorValues[];
}

export const EMPTY_AUTHOR: AuthorValues = { name: "", orcid: "", affiliation: "" };

export const EMPTY_MODEL_FORM: ModelFormValues = {
  title: "",
  summary: "",
  manuscriptTitle: "",
  doi: "",
  url: "",
  year: "",
  venueId: "",
  visibility: "private",
  authors: [{ ...EMPTY_AUTHOR }],
};

export function formValuesOf(m: ModelView): ModelFormValues {
  return {
    title: m.title,
    summary: m.summary,
    manuscriptTitle: m.manuscriptTitle ?? "",
    doi: m.doi ?? "",
    url: m.url ?? "",
    year: m.year === null ? "" : String(m.year),
    venueId: m.venue?.id ?? "",
    visibility: m.visibility,
    authors: m.authors.length === 0 ? [{ ...EMPTY_AUTHOR }] : m.authors.map((a) => ({ name: a.name, orcid: a.orcid ?? "", affiliation: a.affiliation ?? "" })),
  };
}

/** Form values -> schema input. Rows left entirely blank are dropped rather than reported. */
export function toModelInput(v: ModelFormValues): ModelInput {
  const year = v.year.trim();
  return {
    title: v.title,
    summary: v.summary,
    manuscriptTitle: v.manuscriptTitle,
    doi: v.doi,
    url: v.url,
    year: year === "" ? null : /^\d+$/.test(year) ? Number(year) : Number.NaN,
    venueId: v.venueId === "" ? null : v.venueId,
    visibility: v.visibility,
    authors: v.authors.filter((a) => `${a.name}${a.orcid}${a.affiliation}`.trim() !== ""),
  };
}

/** The server action's answer when the posted values do not have the form's shape. */
export const UNEXPECTED_FORM_MESSAGE = "The form sent something unexpected. Reload the page and try again.";

export type FormErrors = Record<string, string>;

/** Field errors keyed by JSON pointer ("/title", "/authors/0/orcid"); the first message per field. */
export function errorsByPointer(problems: readonly { path: string; message: string }[]): FormErrors {
  const out: FormErrors = {};
  for (const p of problems) {
    // zod's message for a non-number year is technical; say what to type instead.
    const message = p.path === "/year" && /expected number/i.test(p.message) ? "A year in digits, e.g. 2024." : p.message;
    out[p.path] ??= message;
  }
  return out;
}

function keptAuthorRows(v: ModelFormValues): number[] {
  return v.authors.flatMap((a, i) => (`${a.name}${a.orcid}${a.affiliation}`.trim() === "" ? [] : [i]));
}

/**
 * Problems found in toModelInput(v) (by the schema here or by the server) keyed by pointers
 * into the form as the author sees it: blank author rows were dropped, so "/authors/1/orcid"
 * of the input may be the form's third row.
 */
export function formErrors(v: ModelFormValues, problems: readonly { path: string; message: string }[]): FormErrors {
  const kept = keptAuthorRows(v);
  return errorsByPointer(
    problems.map((p) => {
      const m = /^\/authors\/(\d+)(\/.*)?$/.exec(p.path);
      if (m === null) return p;
      const row = kept[Number(m[1])] ?? Number(m[1]);
      return { path: `/authors/${row}${m[2] ?? ""}`, message: p.message };
    }),
  );
}

/** The same schema the server applies, run in the browser before anything is sent. */
export function validateModelForm(v: ModelFormValues): FormErrors {
  const result = modelInputSchema.safeParse(toModelInput(v));
  if (result.success) return {};
  return formErrors(
    v,
    result.error.issues.map((issue) => ({
      path: issue.path.length === 0 ? "" : `/${issue.path.map(String).join("/")}`,
      message: issue.message,
    })),
  );
}

/** Shape check for values arriving at a server action (anything may be posted there). */
export function isModelFormValues(x: unknown): x is ModelFormValues {
  if (typeof x !== "object" || x === null) return false;
  const o = x as Record<string, unknown>;
  const strings = ["title", "summary", "manuscriptTitle", "doi", "url", "year", "venueId"] as const;
  return (
    strings.every((k) => typeof o[k] === "string") &&
    (o.visibility === "private" || o.visibility === "public") &&
    Array.isArray(o.authors) &&
    o.authors.every(
      (a: unknown) =>
        typeof a === "object" &&
        a !== null &&
        ["name", "orcid", "affiliation"].every((k) => typeof (a as Record<string, unknown>)[k] === "string"),
    )
  );
}
