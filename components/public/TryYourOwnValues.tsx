"use client";
/**
 * "Try your own values": the reader edits parameters, starting shares and durations; the form
 * checks them in the browser with the engine's own validation (JSON Schema plus semantic
 * rules, loaded on first use), posts the changed spec to the stateless check API, and draws
 * the returned runs and rest points in place. The results are marked as the reader's own.
 */
import { useMemo, useRef, useState, type FormEvent } from "react";
import { ExperimentFigures } from "@/components/plots";
import { RestPointsTable } from "@/components/report";
import { StatusMark } from "@/components/report/StatusMark";
import { Glyph } from "@/components/ui/Glyph";
import type { ClaimResult, ModelSpec, Report, SpecError, State } from "@/lib/engine/types";
import { claimChanges } from "./claim-changes";
import { plotGameOfSpec } from "./plot-game";

interface ExperimentFields {
  id: string;
  duration: string;
  /** One list of share texts per population (one list for a symmetric game). */
  initial: string[][];
}

interface Fields {
  parameters: Record<string, string>;
  experiments: ExperimentFields[];
}

type Phase =
  | { kind: "idle" }
  | { kind: "checking" }
  | { kind: "running" }
  | { kind: "done"; report: Report; changes: string[] }
  | { kind: "failed"; message: string };

const shares = (s: State) => (isPairState(s) ? s.map((p) => `(${p.join(", ")})`).join(" and ") : `(${s.join(", ")})`);

/** What the reader changed, in words, so the results say which values they belong to. */
function changesOf(original: ModelSpec, mine: ModelSpec): string[] {
  const out: string[] = [];
  for (const [k, v] of Object.entries(mine.parameters ?? {})) {
    const was = original.parameters?.[k];
    if (was !== v) out.push(`${k} = ${v} (registered: ${was})`);
  }
  (mine.experiments ?? []).forEach((e, i) => {
    const o = original.experiments?.[i];
    if (o === undefined) return;
    if (o.duration !== e.duration) out.push(`run “${e.id}” lasts ${e.duration} (registered: ${o.duration})`);
    if (JSON.stringify(o.initial) !== JSON.stringify(e.initial)) out.push(`run “${e.id}” starts at ${shares(e.initial)} (registered: ${shares(o.initial)})`);
  });
  return out;
}

/** RFC 6901 token escape, as the engine writes pointers. */
const token = (s: string | number) => String(s).replace(/~/g, "~0").replace(/\//g, "~1");

function isPairState(state: State): state is [number[], number[]] {
  return Array.isArray(state[0]);
}

function fieldsOf(spec: ModelSpec): Fields {
  const parameters: Record<string, string> = {};
  for (const [k, v] of Object.entries(spec.parameters ?? {})) parameters[k] = String(v);
  return {
    parameters,
    experiments: (spec.experiments ?? []).map((e) => ({
      id: e.id,
      duration: String(e.duration),
      initial: isPairState(e.initial) ? e.initial.map((pop) => pop.map(String)) : [e.initial.map(String)],
    })),
  };
}

/** Reads a typed number; "" or text that is no number gives null. */
function parseNumber(text: string): number | null {
  const t = text.trim().replace(/\u2212/g, "-");
  if (t === "") return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
}

function groupNames(spec: ModelSpec): { title: string; strategies: string[] }[] {
  const g = spec.game;
  return g.kind === "symmetric" ? [{ title: "", strategies: g.strategies }] : g.populations.map((p) => ({ title: p.name, strategies: p.strategies }));
}

function summary(claims: readonly ClaimResult[]): string {
  const c = { confirmed: 0, contradicted: 0, inconclusive: 0 };
  for (const x of claims) c[x.status] += 1;
  const parts = (["confirmed", "contradicted", "inconclusive"] as const).filter((k) => c[k] > 0).map((k) => `${c[k]} ${k}`);
  return parts.length === 0 ? "" : `With your values the model's claims come out as: ${parts.join(", ")}.`;
}

/** `registeredClaims`: the claims of the registered report, to say which ones the reader's values changed. */
export function TryYourOwnValues({ specText, registeredClaims }: { specText: string; registeredClaims?: readonly ClaimResult[] }) {
  const original = useMemo(() => JSON.parse(specText) as ModelSpec, [specText]);
  const [fields, setFields] = useState<Fields>(() => fieldsOf(original));
  const [errors, setErrors] = useState<Record<string, string[]>>({});
  const [general, setGeneral] = useState<string[]>([]);
  const [phase, setPhase] = useState<Phase>({ kind: "idle" });
  const resultRef = useRef<HTMLDivElement>(null);
  const formRef = useRef<HTMLFormElement>(null);
  /** Moves the keyboard to the first field that needs attention, after React has marked it. */
  const focusFirstProblem = () =>
    requestAnimationFrame(() => formRef.current?.querySelector<HTMLElement>('[aria-invalid="true"]')?.focus());
  const groups = groupNames(original);
  const plotGame = plotGameOfSpec(original);
  const paramNames = Object.keys(fields.parameters).sort();

  const fieldKeys = useMemo(() => {
    const keys: string[] = paramNames.map((p) => `/parameters/${token(p)}`);
    fields.experiments.forEach((e, i) => {
      keys.push(`/experiments/${i}/duration`, `/experiments/${i}/initial`);
      e.initial.forEach((pop, p) =>
        pop.forEach((_, j) => keys.push(groups.length === 1 ? `/experiments/${i}/initial/${j}` : `/experiments/${i}/initial/${p}/${j}`)),
      );
      if (groups.length === 2) e.initial.forEach((_, p) => keys.push(`/experiments/${i}/initial/${p}`));
    });
    return keys.sort((a, b) => b.length - a.length);
  }, [fields.experiments, groups.length, paramNames]);

  /** Files each problem under the most specific field its pointer falls in; the rest are general. */
  function place(problems: readonly SpecError[]): void {
    const byField: Record<string, string[]> = {};
    const rest: string[] = [];
    for (const p of problems) {
      const key = fieldKeys.find((k) => p.path === k || p.path.startsWith(`${k}/`));
      if (key === undefined) rest.push(p.path === "" ? p.message : `${p.path}: ${p.message}`);
      else (byField[key] ??= []).push(p.message);
    }
    setErrors(byField);
    setGeneral(rest);
  }

  /** The spec with the reader's values, or the fields that are not numbers. */
  function candidate(): { spec: ModelSpec } | { problems: SpecError[] } {
    const problems: SpecError[] = [];
    const num = (text: string, path: string): number => {
      const n = parseNumber(text);
      if (n === null) problems.push({ path, message: "Enter a number." });
      return n ?? 0;
    };
    const spec = structuredClone(original);
    if (spec.parameters !== undefined) {
      for (const name of paramNames) spec.parameters[name] = num(fields.parameters[name] ?? "", `/parameters/${token(name)}`);
    }
    spec.experiments = (original.experiments ?? []).map((e, i) => {
      const f = fields.experiments[i];
      if (f === undefined) return e;
      const shares = f.initial.map((pop, p) =>
        pop.map((s, j) => num(s, groups.length === 1 ? `/experiments/${i}/initial/${j}` : `/experiments/${i}/initial/${p}/${j}`)),
      );
      const initial: State = groups.length === 1 ? (shares[0] ?? []) : [shares[0] ?? [], shares[1] ?? []];
      return { ...e, initial, duration: num(f.duration, `/experiments/${i}/duration`) };
    });
    return problems.length > 0 ? { problems } : { spec };
  }

  async function onSubmit(ev: FormEvent) {
    ev.preventDefault();
    setPhase({ kind: "checking" });
    const c = candidate();
    if ("problems" in c) {
      place(c.problems);
      setPhase({ kind: "idle" });
      focusFirstProblem();
      return;
    }
    // The same validation the server runs, loaded only when a reader first uses the form.
    const { validateSpec } = await import("@/lib/engine/validate");
    const problems = validateSpec(c.spec);
    place(problems);
    if (problems.length > 0) {
      setPhase({ kind: "idle" });
      focusFirstProblem();
      return;
    }
    setPhase({ kind: "running" });
    try {
      const res = await fetch("/api/v1/check", {
        method: "POST",
        headers: { "content-type": "application/json" },
        body: JSON.stringify(c.spec),
      });
      const body = (await res.json().catch(() => null)) as { report?: Report; error?: { message: string; details?: SpecError[] } } | null;
      if (res.ok && body?.report !== undefined) {
        setPhase({ kind: "done", report: body.report, changes: changesOf(original, c.spec) });
        requestAnimationFrame(() => resultRef.current?.focus());
        return;
      }
      if (res.status === 422 && body?.error?.details !== undefined) place(body.error.details);
      setPhase({ kind: "failed", message: body?.error?.message ?? `The re-run service answered with status ${res.status}.` });
    } catch {
      setPhase({ kind: "failed", message: "The re-run service could not be reached. Check your connection and try again." });
    }
  }

  function reset() {
    setFields(fieldsOf(original));
    setErrors({});
    setGeneral([]);
    setPhase({ kind: "idle" });
  }

  function setParam(name: string, value: string) {
    setFields((f) => ({ ...f, parameters: { ...f.parameters, [name]: value } }));
  }
  function setExperiment(i: number, change: (e: ExperimentFields) => ExperimentFields) {
    setFields((f) => ({ ...f, experiments: f.experiments.map((e, k) => (k === i ? change(e) : e)) }));
  }
  /** Rescales one population's shares to sum to 1 (a convenience; the rule itself is the engine's). */
  function normalise(i: number, p: number) {
    setExperiment(i, (e) => {
      const values = (e.initial[p] ?? []).map((s) => Math.max(0, parseNumber(s) ?? 0));
      const total = values.reduce((a, b) => a + b, 0);
      if (total <= 0) return e;
      const scaled = values.map((v) => v / total);
      const fixed = scaled.map((v) => Number(v.toPrecision(12)));
      // Put the rounding remainder on the largest share so the texts sum to 1 within 1e-12.
      const largest = fixed.indexOf(Math.max(...fixed));
      fixed[largest] = Number(((fixed[largest] ?? 0) + 1 - fixed.reduce((a, b) => a + b, 0)).toPrecision(12));
      return { ...e, initial: e.initial.map((pop, q) => (q === p ? fixed.map(String) : pop)) };
    });
  }

  const busy = phase.kind === "checking" || phase.kind === "running";
  const err = (key: string) => errors[key];
  const inputClass = "rp-input w-full font-mono tabular-nums";

  return (
    <div className="flex flex-col gap-6" data-testid="try-values">
      <form
        ref={formRef}
        onSubmit={onSubmit}
        // Start loading the validation code as soon as the reader starts editing.
        onFocusCapture={() => void import("@/lib/engine/validate")}
        noValidate className="rp-card flex flex-col gap-5 p-4 sm:p-5">
        {paramNames.length > 0 && (
          <fieldset className="flex flex-col gap-3">
            <legend className="mb-2 text-sm font-semibold">Parameters</legend>
            <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
              {paramNames.map((name) => {
                const key = `/parameters/${token(name)}`;
                const id = `try-param-${token(name)}`;
                return (
                  <div key={name} className="flex flex-col gap-1">
                    <label htmlFor={id} className="font-mono text-sm italic">
                      {name}
                    </label>
                    <input
                      id={id}
                      inputMode="decimal"
                      autoComplete="off"
                      value={fields.parameters[name] ?? ""}
                      onChange={(e) => setParam(name, e.target.value)}
                      aria-invalid={err(key) ? true : undefined}
                      aria-describedby={err(key) ? `${id}-err` : undefined}
                      className={inputClass}
                      data-testid={`param-${name}`}
                    />
                    {err(key) && (
                      <p id={`${id}-err`} className="text-xs text-danger">
                        {err(key)?.join(" ")}
                      </p>
                    )}
                  </div>
                );
              })}
            </div>
          </fieldset>
        )}

        {fields.experiments.map((e, i) => {
          const dKey = `/experiments/${i}/duration`;
          const gKey = `/experiments/${i}/initial`;
          return (
            <fieldset key={e.id} className="flex flex-col gap-3 border-t border-line pt-4">
              <legend className="text-sm font-semibold">
                Run <q>{e.id}</q>
              </legend>
              <div className="flex max-w-48 flex-col gap-1">
                <label htmlFor={`try-${i}-duration`} className="text-xs font-semibold text-ink-soft">
                  Duration (time units)
                </label>
                <input
                  id={`try-${i}-duration`}
                  inputMode="decimal"
                  autoComplete="off"
                  value={e.duration}
                  onChange={(ev) => setExperiment(i, (x) => ({ ...x, duration: ev.target.value }))}
                  aria-invalid={err(dKey) ? true : undefined}
                  className={inputClass}
                  data-testid={`duration-${e.id}`}
                />
                {err(dKey) && <p className="text-xs text-danger">{err(dKey)?.join(" ")}</p>}
              </div>
              {groups.map((g, p) => {
                const popKey = groups.length === 1 ? gKey : `${gKey}/${p}`;
                return (
                  <div key={p} className="flex flex-col gap-2">
                    <p className="text-xs font-semibold text-ink-soft">Starting shares{g.title === "" ? "" : ` of ${g.title}`}</p>
                    <div className="grid grid-cols-2 gap-3 sm:grid-cols-4">
                      {g.strategies.map((s, j) => {
                        const key = `${popKey}/${j}`;
                        const id = `try-${i}-${p}-${j}`;
                        return (
                          <div key={j} className="flex min-w-0 flex-col gap-1">
                            <label htmlFor={id} className="truncate text-xs" title={s}>
                              {s}
                            </label>
                            <input
                              id={id}
                              inputMode="decimal"
                              autoComplete="off"
                              value={e.initial[p]?.[j] ?? ""}
                              onChange={(ev) =>
                                setExperiment(i, (x) => ({
                                  ...x,
                                  initial: x.initial.map((pop, q) => (q === p ? pop.map((v, k) => (k === j ? ev.target.value : v)) : pop)),
                                }))
                              }
                              aria-invalid={err(key) || err(popKey) ? true : undefined}
                              aria-describedby={err(popKey) ? `try-${i}-${p}-sum` : undefined}
                              className={inputClass}
                            />
                            {err(key) && <p className="text-xs text-danger">{err(key)?.join(" ")}</p>}
                          </div>
                        );
                      })}
                    </div>
                    {err(popKey) && (
                      <div className="flex flex-wrap items-center gap-3">
                        <p id={`try-${i}-${p}-sum`} className="text-xs text-danger" role="alert">
                          {err(popKey)?.join(" ")}
                        </p>
                        <button type="button" className="text-xs font-semibold text-tide hover:underline" onClick={() => normalise(i, p)}>
                          Scale these shares to sum to 1
                        </button>
                      </div>
                    )}
                  </div>
                );
              })}
              {groups.length === 2 && err(gKey) && (
                <p className="text-xs text-danger" role="alert">
                  {err(gKey)?.join(" ")}
                </p>
              )}
            </fieldset>
          );
        })}

        {general.length > 0 && (
          <ul className="list-disc pl-5 text-sm text-danger" role="alert">
            {general.map((g, i) => (
              <li key={i}>{g}</li>
            ))}
          </ul>
        )}

        <div className="flex flex-wrap items-center gap-3">
          <button type="submit" disabled={busy} className="inline-flex items-center justify-center gap-2 rounded-[var(--radius-control)] bg-tide px-4 py-2 text-sm font-semibold text-on-tide hover:bg-tide-strong disabled:opacity-60">
            {phase.kind === "running" ? "Re-running…" : phase.kind === "checking" ? "Checking…" : "Re-run with these values"}
          </button>
          <button type="button" onClick={reset} disabled={busy} className="rounded-[var(--radius-control)] px-3 py-2 text-sm font-semibold text-tide hover:bg-tide-wash">
            Back to the registered values
          </button>
          <span role="status" aria-live="polite" className="text-sm text-ink-soft">
            {phase.kind === "failed" ? <span className="text-danger">{phase.message}</span> : null}
            {Object.keys(errors).length + general.length > 0 && phase.kind !== "failed" ? "Some values need attention before the model can be re-run." : null}
          </span>
        </div>
      </form>

      {phase.kind === "done" && (
        <div ref={resultRef} tabIndex={-1} className="flex flex-col gap-5 rounded-[var(--radius-card)] border-2 border-dashed border-ochre p-4 outline-none sm:p-5" data-testid="own-results">
          <div className="flex flex-col gap-1">
            <p className="text-xs font-semibold uppercase tracking-[0.12em] text-ochre">Your own results</p>
            <p className="text-sm">
              Computed just now from the values you entered. These are <strong>not</strong> the registered results of this version, and
              they are not stored.
            </p>
            <p className="text-sm text-ink-soft" data-testid="own-changes">
              {phase.changes.length === 0 ? "You kept the registered values." : `Your values: ${phase.changes.join("; ")}.`}
            </p>
            {summary(phase.report.claims) !== "" && <p className="text-sm text-ink-soft">{summary(phase.report.claims)}</p>}
          </div>
          {registeredClaims !== undefined && phase.report.claims.length > 0 && (
            <ClaimChanges changes={claimChanges(registeredClaims, phase.report.claims)} />
          )}
          {plotGame !== null && (
            <ExperimentFigures game={plotGame} experiments={phase.report.experiments} restPoints={phase.report.restPoints ?? []} />
          )}
          {phase.report.restPoints !== undefined && (
            <div className="flex flex-col gap-2">
              <h3 className="text-base font-semibold">Rest points with your values</h3>
              <RestPointsTable restPoints={phase.report.restPoints} game={original.game} />
            </div>
          )}
        </div>
      )}
    </div>
  );
}

/** Which claims came out differently from the registered report, with the engine's sentence for each. */
function ClaimChanges({ changes }: { changes: ReturnType<typeof claimChanges> }) {
  if (changes.length === 0) {
    return (
      <p className="text-sm" data-testid="own-claim-changes">
        Every claim has the same status as in the registered report.
      </p>
    );
  }
  return (
    <div className="flex flex-col gap-2" data-testid="own-claim-changes">
      <h3 className="text-base font-semibold">
        {changes.length === 1 ? "1 claim changed status" : `${changes.length} claims changed status`} compared with the registered report
      </h3>
      <ul className="flex flex-col gap-2">
        {changes.map((c) => (
          <li key={c.id} className="rounded-[var(--radius-control)] border border-line bg-surface px-3 py-2 text-sm" data-claim={c.id} data-from={c.from ?? "none"} data-to={c.to}>
            <p className="flex flex-wrap items-center gap-x-2 gap-y-1">
              <span className="font-mono text-xs break-all">{c.id}</span>
              {c.from === null ? <span className="text-ink-faint">not in the registered report</span> : <StatusMark outcome={c.from} />}
              <span aria-hidden="true">
                <Glyph char="→" />
              </span>
              <span className="sr-only">now</span>
              <StatusMark outcome={c.to} />
            </p>
            <p className="mt-1 text-ink-soft">{c.message}</p>
          </li>
        ))}
      </ul>
    </div>
  );
}
