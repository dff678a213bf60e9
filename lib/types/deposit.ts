/**
 * What authors deposit and what the workspace shows: the model entry's input schema (used by
 * the client form and by lib/models.ts alike) and the view types the data-access modules
 * return. Timestamps are ISO strings so the same types hold on server and client.
 */
import { z } from "zod";
import type { Role, Visibility } from "@/db/schema";
import type { ClaimStatus, Report, SpecError, Verdict } from "@/lib/engine/types";
import type { JobStatus } from "@/lib/types/jobs";

/** Who is asking: a signed-in account, or null for an anonymous reader. */
export type Viewer = { id: string; role: Role | string } | null;

// ---------------------------------------------------------------------------
// ORCID iD (ISO 7064 MOD 11-2 check character, as documented by ORCID:
// https://support.orcid.org/hc/en-us/articles/360006897674)
// ---------------------------------------------------------------------------

const ORCID_URL_PREFIX = /^https?:\/\/(www\.)?orcid\.org\//i;

/** "https://orcid.org/0000-0002-1825-0097" or the bare iD -> the bare iD in upper case. */
export function normalizeOrcid(value: string): string {
  return value.trim().replace(ORCID_URL_PREFIX, "").toUpperCase();
}

/** True for a well-formed iD (0000-0000-0000-000X) whose last character is the MOD 11-2 check. */
export function isValidOrcid(value: string): boolean {
  const id = normalizeOrcid(value);
  if (!/^\d{4}-\d{4}-\d{4}-\d{3}[\dX]$/.test(id)) return false;
  const digits = id.replace(/-/g, "");
  let total = 0;
  for (const ch of digits.slice(0, 15)) total = (total + Number(ch)) * 2;
  const result = (12 - (total % 11)) % 11;
  const check = result === 10 ? "X" : String(result);
  return digits[15] === check;
}

// ---------------------------------------------------------------------------
// Model entry input
// ---------------------------------------------------------------------------

const optionalText = (max: number) =>
  z
    .string()
    .trim()
    .max(max, `At most ${max} characters.`)
    .transform((s) => (s === "" ? null : s))
    .nullable()
    .optional();

export const DOI_PATTERN = /^10\.\d{4,9}\/\S+$/;

export const authorInputSchema = z.object({
  name: z.string().trim().min(1, "An author needs a name.").max(200, "At most 200 characters."),
  orcid: z
    .string()
    .trim()
    .transform((s) => (s === "" ? null : normalizeOrcid(s)))
    .refine((s) => s === null || isValidOrcid(s), "Not a valid ORCID iD (0000-0000-0000-000X with a correct check character).")
    .nullable()
    .optional(),
  affiliation: optionalText(300),
});

export const modelInputSchema = z.object({
  title: z.string().trim().min(1, "The model needs a title.").max(300, "At most 300 characters."),
  summary: z.string().trim().max(5000, "At most 5000 characters.").default(""),
  manuscriptTitle: optionalText(500),
  doi: z
    .string()
    .trim()
    .transform((s) => (s === "" ? null : s.replace(/^https?:\/\/(dx\.)?doi\.org\//i, "")))
    .refine((s) => s === null || DOI_PATTERN.test(s), "Not a DOI (10.NNNN/...).")
    .nullable()
    .optional(),
  url: z
    .string()
    .trim()
    .transform((s) => (s === "" ? null : s))
    .refine((s) => s === null || /^https?:\/\/[^\s]+$/i.test(s), "Not a web address (http:// or https://).")
    .nullable()
    .optional(),
  year: z.number().int("A whole year.").min(1900, "A year from 1900 on.").max(2100, "A year up to 2100.").nullable().optional(),
  authors: z.array(authorInputSchema).max(100, "At most 100 authors.").default([]),
  venueId: z.string().trim().min(1).nullable().optional(),
  visibility: z.enum(["private", "public"]).default("private"),
});

export type ModelInput = z.input<typeof modelInputSchema>;
export type ModelFields = z.output<typeof modelInputSchema>;

// ---------------------------------------------------------------------------
// Views
// ---------------------------------------------------------------------------

export interface ModelAuthorView {
  name: string;
  orcid: string | null;
  affiliation: string | null;
}

export interface VenueRef {
  id: string;
  slug: string;
  name: string;
}

export interface ClaimCounts {
  confirmed: number;
  contradicted: number;
  inconclusive: number;
}

export interface VersionSummary {
  id: string;
  modelId: string;
  number: number;
  specSha256: string;
  title: string;
  dynamicsKind: string;
  strategyNames: string[];
  createdAt: string;
  uploadedBy: string;
  /** null until the job finishes */
  verdict: Verdict | null;
  counts: ClaimCounts | null;
  job: JobStatus | null;
}

export interface ModelView {
  id: string;
  slug: string;
  ownerId: string;
  title: string;
  summary: string;
  manuscriptTitle: string | null;
  doi: string | null;
  url: string | null;
  year: number | null;
  authors: ModelAuthorView[];
  venue: VenueRef | null;
  visibility: Visibility;
  createdAt: string;
  updatedAt: string;
  /** Newest first. */
  versions: VersionSummary[];
  /** What the viewer may do (drives buttons; the server checks again). */
  canEdit: boolean;
}

export interface FileInfo {
  id: string;
  modelId: string | null;
  versionId: string | null;
  purpose: "spec" | "supplement";
  sha256: string;
  size: number;
  mediaType: string;
  /** Display only: the client's name with path separators and control characters removed. */
  originalName: string;
  uploadedBy: string;
  createdAt: string;
}

export interface VersionView extends VersionSummary {
  specText: string;
  files: FileInfo[];
}

export interface ClaimRowView {
  position: number;
  claimId: string;
  kind: string;
  status: ClaimStatus;
  deviation: number | null;
  message: string;
}

export interface ReportView {
  id: string;
  versionId: string;
  verdict: Verdict;
  engineVersion: string;
  specSha256: string;
  counts: ClaimCounts;
  durationMs: number | null;
  createdAt: string;
  claims: ClaimRowView[];
  /** The report exactly as the engine produced it. */
  report: Report;
}

export type AddVersionResult =
  | { status: "created"; version: VersionSummary }
  /** The same spec (by specSha256) is already this model's version `version.number`. */
  | { status: "identical"; version: VersionSummary };

export type { SpecError };
