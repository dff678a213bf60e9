/**
 * Validation of a model spec: the JSON Schema (draft 2020-12, schemas/model-spec.v1.schema.json,
 * compiled once with ajv) and then the rules a schema cannot express (matrix shapes, states
 * summing to 1, references between claims, experiments and strategies, parameters used by
 * expressions, payoffs that evaluate to NaN or Infinity, ORCID check digits). Every error
 * carries the RFC 6901 pointer of the offending value and one plain sentence. When the schema
 * fails, the rules still run on the parts that passed it, so all problems come in one answer.
 */
import Ajv2020, { type ErrorObject } from "ajv/dist/2020";
import addFormats from "ajv-formats";
import schema from "../../schemas/model-spec.v1.schema.json";
import { MAX_DEPTH, jsonDepth } from "./json-depth";
import { PayoffError, compileExpression, compileGame } from "./payoffs";
import type { GameSpec, ModelSpec, Parameters, SpecError } from "./types";

/** Specs above this many bytes of JSON text are refused before parsing. */
export const MAX_INPUT_BYTES = 1_000_000;
/** States must sum to 1 within this. */
export const STATE_SUM_TOLERANCE = 1e-9;

const ajv = new Ajv2020({ allErrors: true, strict: true, allowUnionTypes: true, discriminator: true });
addFormats(ajv);
const validateSchema = ajv.compile(schema);

const KINDS: Record<string, string[]> = {
  "/game": ["symmetric", "bimatrix"],
  "/dynamics": ["replicator", "replicator-mutator", "logit", "brown-von-neumann-nash", "smith"],
  claim: ["rest-point", "nash-equilibrium", "ess", "rest-point-count", "final-state", "trajectory", "fixation-probability"],
};

/** Escapes one token for a JSON pointer (RFC 6901). */
export function pointerToken(token: string | number): string {
  return String(token).replace(/~/g, "~0").replace(/\//g, "~1");
}

function lastToken(path: string): string {
  const t = path.split("/").pop() ?? "";
  return t.replace(/~1/g, "/").replace(/~0/g, "~");
}

function subject(path: string): string {
  if (path === "") return "The spec";
  const t = lastToken(path);
  return /^\d+$/.test(t) ? `Entry ${Number(t) + 1} of "${lastToken(path.slice(0, path.lastIndexOf("/"))) || "the list"}"` : `"${t}"`;
}

function valueAt(root: unknown, path: string): unknown {
  if (path === "") return root;
  let v: unknown = root;
  for (const raw of path.split("/").slice(1)) {
    const t = raw.replace(/~1/g, "/").replace(/~0/g, "~");
    if (v === null || typeof v !== "object") return undefined;
    v = (v as Record<string, unknown>)[t];
  }
  return v;
}

const isClaimPath = (p: string): boolean => /^\/claims\/\d+$/.test(p);

/** One ajv error as a sentence a modeller can act on. */
function describe(e: ErrorObject, root: unknown): SpecError {
  const path = e.instancePath;
  const p = e.params as Record<string, unknown>;
  const here = valueAt(root, path);
  const subj = subject(path);
  switch (e.keyword) {
    case "required": {
      const prop = String(p.missingProperty);
      return { path: `${path}/${pointerToken(prop)}`, message: `The field "${prop}" is required here but missing.` };
    }
    case "additionalProperties": {
      const prop = String(p.additionalProperty);
      return { path: `${path}/${pointerToken(prop)}`, message: `"${prop}" is not a field the format knows here; check its spelling or remove it.` };
    }
    case "const":
      if (path === "/format") return { path, message: `The format must be "restpoint/model@1"; this file says ${JSON.stringify(here)}.` };
      return { path, message: `${subj} must be ${JSON.stringify(p.allowedValue)}.` };
    case "enum":
      return { path, message: `${subj} must be one of ${(p.allowedValues as unknown[]).map((v) => JSON.stringify(v)).join(", ")}.` };
    case "type": {
      if (/^\/game\/payoffs(\/\d+){2,3}$/.test(path)) return { path, message: "A payoff must be a number or an expression string over the parameters." };
      const t = String(p.type);
      const word = t === "integer" ? "a whole number" : t === "array" ? "a list" : t === "object" ? "an object" : `a ${t}`;
      return { path, message: `${subj} must be ${word}.` };
    }
    case "discriminator": {
      const key = path === "/game" || path === "/dynamics" ? path : isClaimPath(path) ? "claim" : path;
      const kinds = KINDS[key] ?? [];
      const what = key === "/game" ? "game" : key === "/dynamics" ? "dynamics" : "claim";
      if (p.error === "mapping") {
        return { path: `${path}/kind`, message: `Unknown ${what} kind ${JSON.stringify(p.tagValue)}; use one of ${kinds.join(", ")}.` };
      }
      return { path: `${path}/kind`, message: `The ${what} kind must be a string: one of ${kinds.join(", ")}.` };
    }
    case "minimum":
    case "maximum":
    case "exclusiveMinimum":
    case "exclusiveMaximum": {
      const limit = Number(p.limit);
      const field = lastToken(path);
      if (field === "samples" && e.keyword === "maximum") return { path, message: `An experiment may ask for at most ${limit} samples; this one asks for ${String(here)}.` };
      if (field === "duration" && e.keyword === "maximum") return { path, message: `The duration ${String(here)} is too long: runs are limited to ${limit} time units.` };
      if (field === "populationSize") return { path, message: `The population size must be from 2 to 100000; it is ${String(here)}.` };
      const rel = e.keyword === "minimum" ? "at least" : e.keyword === "maximum" ? "at most" : e.keyword === "exclusiveMinimum" ? "greater than" : "less than";
      if (/\/(state|initial)(\/\d+)+$/.test(path)) return { path, message: `A share must lie between 0 and 1; this one is ${String(here)}.` };
      return { path, message: `${subj} must be ${rel} ${limit}; it is ${String(here)}.` };
    }
    case "minItems":
    case "maxItems": {
      const limit = Number(p.limit);
      const len = Array.isArray(here) ? here.length : 0;
      if (lastToken(path) === "strategies" && e.keyword === "maxItems") return { path, message: `The game has ${len} strategies; the engine handles at most ${limit}.` };
      if (lastToken(path) === "strategies") return { path, message: `A game needs at least ${limit} strategies; this one has ${len}.` };
      if (path === "/claims") return { path, message: "The spec must make at least one claim." };
      return { path, message: `${subj} must have ${e.keyword === "minItems" ? "at least" : "at most"} ${limit} entries; it has ${len}.` };
    }
    case "minLength":
    case "maxLength": {
      const limit = Number(p.limit);
      const len = typeof here === "string" ? here.length : 0;
      const payoff = /^\/game\/payoffs(\/\d+){2,3}$/.test(path);
      if (e.keyword === "minLength") return { path, message: payoff ? "A payoff expression must not be empty." : `${subj} must not be empty.` };
      if (payoff) return { path, message: `The expression is ${len} characters long; payoff expressions are limited to ${limit} characters.` };
      return { path, message: `${subj} is ${len} characters long; at most ${limit} are allowed.` };
    }
    case "pattern": {
      const field = lastToken(path);
      if (field === "orcid") return { path, message: `${JSON.stringify(here)} is not an ORCID iD; write it as four groups of four digits (the last may be X), as in 0000-0002-1825-0097.` };
      if (field === "doi") return { path, message: `${JSON.stringify(here)} is not a DOI; a DOI starts with 10., a registrant code of at least 4 digits and a slash, as in 10.1000/xyz123.` };
      if (field === "url") return { path, message: `${JSON.stringify(here)} must be an http or https address.` };
      if (e.schemaPath.includes("propertyNames")) return { path, message: "Parameter names must start with a letter and contain only letters, digits and underscores (at most 64 characters)." };
      return { path, message: `${JSON.stringify(here)} is not a valid identifier here: use lower-case letters, digits and single hyphens, as in "long-run-share".` };
    }
    case "propertyNames":
      return { path: `${path}/${pointerToken(String(p.propertyName))}`, message: `${JSON.stringify(p.propertyName)} is not a valid parameter name: it must start with a letter and contain only letters, digits and underscores (at most 64 characters).` };
    case "uniqueItems":
      return { path: `${path}/${String(p.i)}`, message: `Strategy names must be unique; ${JSON.stringify(Array.isArray(here) ? here[Number(p.i)] : "")} appears twice.` };
    case "maxProperties":
      return { path, message: `${subj} may have at most ${String(p.limit)} entries.` };
    case "format":
      return { path, message: `${JSON.stringify(here)} is not a valid web address.` };
    default:
      return { path, message: `${subj}: ${e.message ?? "is not valid"}.` };
  }
}

/**
 * Drops ajv's duplicates: the pattern error behind a propertyNames failure, the type or
 * required error of a `kind` that the discriminator error already explains, and the
 * summary of an if/then/else whose branch errors are listed.
 */
function prune(errors: ErrorObject[]): ErrorObject[] {
  const names = errors.filter((e) => e.keyword === "propertyNames");
  const tags = errors.filter((e) => e.keyword === "discriminator");
  return errors.filter((e) => {
    if (e.keyword === "if") return false;
    if (e.keyword === "pattern" && e.schemaPath.includes("propertyNames") && names.some((n) => n.instancePath === e.instancePath)) return false;
    if (e.keyword === "required" && String((e.params as Record<string, unknown>).missingProperty) === "kind" && tags.some((d) => d.instancePath === e.instancePath)) return false;
    if (e.keyword === "type" && tags.some((d) => e.instancePath === `${d.instancePath}/kind`)) return false;
    return true;
  });
}

/** ORCID check character (ISO 7064 MOD 11-2 over the first 15 digits). */
export function orcidChecksumValid(orcid: string): boolean {
  const digits = orcid.replace(/-/g, "");
  if (!/^\d{15}[\dX]$/.test(digits)) return false;
  let total = 0;
  for (let i = 0; i < 15; i++) total = (total + Number(digits[i])) * 2;
  const result = (12 - (total % 11)) % 11;
  return digits[15] === (result === 10 ? "X" : String(result));
}

function dedupe(errors: SpecError[]): SpecError[] {
  const seen = new Set<string>();
  return errors.filter((e) => {
    const key = `${e.path}\u0000${e.message}`;
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

/** Checks a state's shape for the game and that each population's shares sum to 1. */
function checkState(state: unknown, path: string, game: GameSpec, out: SpecError[]): void {
  if (!Array.isArray(state)) return;
  const sums = (shares: unknown[], p: string, n: number, who: string): void => {
    if (shares.length !== n) {
      out.push({ path: p, message: `${who} must have ${n} shares, one per strategy in order; it has ${shares.length}.` });
      return;
    }
    let s = 0;
    for (const v of shares) s += typeof v === "number" ? v : Number.NaN;
    if (!(Math.abs(s - 1) <= STATE_SUM_TOLERANCE)) {
      out.push({ path: p, message: `The shares of ${who.toLowerCase()} must sum to 1 (within ${STATE_SUM_TOLERANCE}); they sum to ${Number.isFinite(s) ? String(Number(s.toPrecision(15))) : "a non-number"}.` });
    }
  };
  if (game.kind === "symmetric") {
    if (state.some((v) => Array.isArray(v))) {
      out.push({ path, message: "This is a symmetric game: a state is one list of shares, not a pair of lists." });
      return;
    }
    sums(state, path, game.strategies.length, "The state");
    return;
  }
  const [x, y] = state as unknown[];
  if (state.length !== 2 || !Array.isArray(x) || !Array.isArray(y)) {
    out.push({ path, message: "This is a two-population game: a state is a pair [x, y] with one list of shares per population." });
    return;
  }
  sums(x, `${path}/0`, game.populations[0].strategies.length, `The state of ${game.populations[0].name}`);
  sums(y, `${path}/1`, game.populations[1].strategies.length, `The state of ${game.populations[1].name}`);
}

function checkMatrix(rows: unknown[], path: string, r: number, c: number, what: string, unit: string, out: SpecError[]): boolean {
  if (rows.length !== r) {
    out.push({ path, message: `${what} must have ${r} rows (one per strategy); it has ${rows.length}.` });
    return false;
  }
  let ok = true;
  rows.forEach((row, i) => {
    if (Array.isArray(row) && row.length !== c) {
      out.push({ path: `${path}/${i}`, message: `Row ${i + 1} of ${what.charAt(0).toLowerCase()}${what.slice(1)} must have ${c} entries (one per ${unit}); it has ${row.length}.` });
      ok = false;
    }
  });
  return ok;
}

function experimentList(spec: ModelSpec): NonNullable<ModelSpec["experiments"]> {
  return Array.isArray(spec.experiments) ? spec.experiments : [];
}

function claimList(spec: ModelSpec): ModelSpec["claims"] {
  return Array.isArray(spec.claims) ? spec.claims : [];
}

/**
 * Ids used twice among experiments and among claims (only entries that passed the schema are
 * judged; any string id counts as taken). Returns where each experiment id is first defined.
 */
function checkIds(spec: ModelSpec, clean: (pointer: string) => boolean, out: SpecError[]): Map<string, number> {
  const experimentIds = new Map<string, number>();
  experimentList(spec).forEach((ex, i) => {
    const id: unknown = (ex as { id?: unknown } | null)?.id;
    if (typeof id !== "string") return;
    if (experimentIds.has(id)) {
      if (clean(`/experiments/${i}`)) out.push({ path: `/experiments/${i}/id`, message: `The experiment id "${id}" is used twice; ids must be unique.` });
    } else experimentIds.set(id, i);
  });
  const claimIds = new Set<string>();
  claimList(spec).forEach((c, i) => {
    const id: unknown = (c as { id?: unknown } | null)?.id;
    if (typeof id !== "string") return;
    if (claimIds.has(id) && clean(`/claims/${i}`)) out.push({ path: `/claims/${i}/id`, message: `The claim id "${id}" is used twice; ids must be unique.` });
    claimIds.add(id);
  });
  return experimentIds;
}

/** Every part of the spec passed the schema (the predicate used once the whole spec did). */
const ALL_CLEAN = (): boolean => true;

/**
 * Semantic rules beyond the schema. `clean(pointer)` says whether the value at that pointer
 * passed the schema with nothing wrong inside it; a rule runs only when every value it reads
 * is clean, so a spec that failed the schema still gets the checks that are safe on the parts
 * that passed (a claim's state summing to 1.2 beside a misspelled field elsewhere).
 */
function semanticErrors(spec: ModelSpec, clean: (pointer: string) => boolean = ALL_CLEAN): SpecError[] {
  const out: SpecError[] = [];
  // A missing game is reported at the root (required), so its own pointer looks clean: check it is there.
  const gameOk = clean("/game") && spec.game !== null && typeof spec.game === "object";
  const paramsOk = clean("/parameters");
  const game = spec.game;
  const authors = Array.isArray(spec.authors) ? spec.authors : [];
  authors.forEach((a, i) => {
    if (!clean(`/authors/${i}`)) return;
    if (a.orcid !== undefined && !orcidChecksumValid(a.orcid)) {
      out.push({ path: `/authors/${i}/orcid`, message: `The ORCID iD ${a.orcid} has a wrong check digit (ISO 7064 MOD 11-2); it is probably mistyped.` });
    }
  });
  if (!gameOk) {
    checkIds(spec, clean, out);
    return out;
  }
  let shapesOk: boolean;
  if (game.kind === "symmetric") {
    const n = game.strategies.length;
    shapesOk = checkMatrix(game.payoffs, "/game/payoffs", n, n, "The payoff matrix", "strategy", out);
  } else {
    const m = game.populations[0].strategies.length;
    const k = game.populations[1].strategies.length;
    const a = checkMatrix(game.payoffs[0], "/game/payoffs/0", m, k, `The payoff matrix of ${game.populations[0].name}`, `strategy of ${game.populations[1].name}`, out);
    const b = checkMatrix(game.payoffs[1], "/game/payoffs/1", k, m, `The payoff matrix of ${game.populations[1].name}`, `strategy of ${game.populations[0].name}`, out);
    shapesOk = a && b;
  }

  const defined = new Set(Object.keys(spec.parameters ?? {}));
  const checkOverrides = (params: Parameters | undefined, base: string): boolean => {
    let ok = true;
    if (!paramsOk) return false;
    for (const name of Object.keys(params ?? {})) {
      if (!defined.has(name)) {
        out.push({ path: `${base}/parameters/${pointerToken(name)}`, message: `"${name}" overrides a parameter the spec does not define; define it under "parameters" first.` });
        ok = false;
      }
    }
    return ok;
  };

  // Expressions: structure and parameter names, once per entry (names need clean parameters).
  let exprOk = shapesOk && paramsOk;
  const matrices: [unknown[], string][] = game.kind === "symmetric" ? [[game.payoffs, "/game/payoffs"]] : [[game.payoffs[0], "/game/payoffs/0"], [game.payoffs[1], "/game/payoffs/1"]];
  for (const [rows, base] of paramsOk ? matrices : []) {
    rows.forEach((row, i) => {
      if (!Array.isArray(row)) return;
      row.forEach((entry, j) => {
        if (typeof entry !== "string") return;
        try {
          compileExpression(entry, `${base}/${i}/${j}`, defined);
        } catch (e) {
          if (e instanceof PayoffError) {
            out.push({ path: e.path, message: e.message });
            exprOk = false;
          } else throw e;
        }
      });
    });
  }

  const experimentIds = checkIds(spec, clean, out);
  experimentList(spec).forEach((ex, i) => {
    if (!clean(`/experiments/${i}`)) return;
    checkState(ex.initial, `/experiments/${i}/initial`, game, out);
    checkOverrides(ex.parameters, `/experiments/${i}`);
  });

  const strategyNames = game.kind === "symmetric" ? game.strategies : [];
  claimList(spec).forEach((c, i) => {
    const base = `/claims/${i}`;
    if (!clean(base)) return;
    checkOverrides(c.parameters, base);
    switch (c.kind) {
      case "rest-point":
      case "nash-equilibrium":
        checkState(c.state, `${base}/state`, game, out);
        break;
      case "ess":
        if (game.kind !== "symmetric") out.push({ path: `${base}/kind`, message: "ESS claims apply to symmetric games only; this game has two populations." });
        else checkState(c.state, `${base}/state`, game, out);
        break;
      case "rest-point-count":
        break;
      case "final-state":
      case "trajectory": {
        const ei = experimentIds.get(c.experiment);
        const ex = ei === undefined ? undefined : spec.experiments?.[ei];
        // An experiment that failed the schema may be the one meant: say nothing then.
        if (ex === undefined && clean("/experiments")) {
          out.push({ path: `${base}/experiment`, message: `The claim refers to the experiment "${c.experiment}", which the spec does not define.` });
        }
        if (c.kind === "final-state") checkState(c.state, `${base}/state`, game, out);
        else {
          c.points.forEach((pt, j) => {
            if (ex !== undefined && ei !== undefined && clean(`/experiments/${ei}`) && pt.t > ex.duration) {
              out.push({ path: `${base}/points/${j}/t`, message: `The time ${pt.t} lies beyond the end of the experiment "${ex.id}" (duration ${ex.duration}).` });
            }
            checkState(pt.state, `${base}/points/${j}/state`, game, out);
          });
        }
        break;
      }
      case "fixation-probability": {
        if (game.kind !== "symmetric") {
          out.push({ path: `${base}/kind`, message: "Fixation-probability claims apply to symmetric games only; this game has two populations." });
          break;
        }
        for (const field of ["mutant", "resident"] as const) {
          if (!strategyNames.includes(c[field])) {
            out.push({ path: `${base}/${field}`, message: `The ${field} "${c[field]}" is not one of the game's strategies (${strategyNames.join(", ")}).` });
          }
        }
        if (c.mutant === c.resident) out.push({ path: `${base}/resident`, message: "The mutant and the resident must be different strategies." });
        break;
      }
    }
  });

  // Payoffs at every parameter set in use must be finite numbers.
  if (exprOk) {
    const sets: [Parameters | undefined, string][] = [[undefined, ""]];
    experimentList(spec).forEach((ex, i) => {
      if (clean(`/experiments/${i}`) && ex.parameters !== undefined) sets.push([ex.parameters, ` with the parameters of experiment "${ex.id}"`]);
    });
    claimList(spec).forEach((c, i) => {
      if (clean(`/claims/${i}`) && c.parameters !== undefined) sets.push([c.parameters, ` with the parameters of claim "${c.id}"`]);
    });
    const failed = new Set<string>();
    for (const [params, where] of sets) {
      if (params !== undefined && Object.keys(params).some((k) => !defined.has(k))) continue;
      try {
        compileGame(spec, params);
      } catch (e) {
        if (!(e instanceof PayoffError)) throw e;
        if (failed.has(e.path)) continue;
        failed.add(e.path);
        out.push({ path: e.path, message: where === "" ? e.message : e.message.replace(/\.$/, `${where}.`) });
      }
    }
  }
  return out;
}

/**
 * Validates a parsed spec: schema first, then semantic rules. Returns [] for a valid spec.
 * Deeply nested input is refused before the schema is applied.
 */
export function validateSpec(input: unknown): SpecError[] {
  const depth = jsonDepth(input, MAX_DEPTH);
  if (depth > MAX_DEPTH) {
    return [{ path: "", message: `The JSON is nested more than ${MAX_DEPTH} levels deep; a model spec never needs that, so it is refused.` }];
  }
  if (!validateSchema(input)) {
    const raw = validateSchema.errors ?? [];
    const schemaErrors = prune(raw).map((e) => describe(e, input));
    // Semantic checks on the parts that passed, so every problem is reported in one round,
    // listed in the order of the file.
    // Only an object can hold parts; a value with nothing clean gets the schema errors alone.
    const failedAt = raw.map((e) => e.instancePath);
    const clean = (pointer: string): boolean => !failedAt.some((p) => p === pointer || p.startsWith(`${pointer}/`));
    const partial = input !== null && typeof input === "object" && !Array.isArray(input) ? semanticErrors(input as ModelSpec, clean) : [];
    return byPointer(input, dedupe([...schemaErrors, ...partial]));
  }
  return dedupe(semanticErrors(input as unknown as ModelSpec));
}

/**
 * Compares two JSON pointers in document order: token by token, array entries by index and
 * object members in the order they appear in `root` (the order of the uploaded text, so the
 * list reads top to bottom like the file). A member `root` does not have (a missing required
 * field) comes after those it has, then by name.
 */
export function comparePointers(root: unknown, a: string, b: string): number {
  const ta = a === "" ? [] : a.split("/").slice(1).map(unescapeToken);
  const tb = b === "" ? [] : b.split("/").slice(1).map(unescapeToken);
  let here: unknown = root;
  for (let i = 0; i < Math.min(ta.length, tb.length); i++) {
    const x = ta[i] ?? "";
    const y = tb[i] ?? "";
    if (x !== y) {
      if (/^\d+$/.test(x) && /^\d+$/.test(y)) return Number(x) - Number(y);
      const keys = here !== null && typeof here === "object" && !Array.isArray(here) ? Object.keys(here) : [];
      const ix = keys.indexOf(x);
      const iy = keys.indexOf(y);
      if (ix >= 0 && iy >= 0) return ix - iy;
      if (ix >= 0 || iy >= 0) return ix >= 0 ? -1 : 1;
      return x < y ? -1 : 1;
    }
    here = here !== null && typeof here === "object" ? (here as Record<string, unknown>)[x] : undefined;
  }
  return ta.length - tb.length;
}

function unescapeToken(t: string): string {
  return t.replace(/~1/g, "/").replace(/~0/g, "~");
}

/** Errors in document order of their pointers; errors at one pointer keep their order (stable sort). */
function byPointer(root: unknown, errors: SpecError[]): SpecError[] {
  return [...errors].sort((a, b) => comparePointers(root, a.path, b.path));
}
