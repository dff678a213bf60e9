/**
 * What the engine found that no claim mentions: rest points nobody claimed (stable ones and
 * ESSs first), a rest point claimed without its stability, no claim about how many rest
 * points there are, experiments no claim refers to. Editors see these beside the report so
 * that what a paper may have missed is in front of them. Pure: spec and report in, list out.
 */
import type { Claim, ModelSpec, Report, RestPointReport, State } from "@/lib/engine/types";

export type FindingKind = "unclaimed-rest-point" | "stability-not-stated" | "count-not-stated" | "experiment-unused";

export interface Finding {
  kind: FindingKind;
  /** One sentence for the editor. */
  text: string;
  /** The rest point concerned, when there is one. */
  restPoint?: RestPointReport;
  /** The claim or experiment concerned. */
  ref?: string;
}

/** Default tolerances of the state claims (restpoint/model@1). */
const DEFAULT_TOLERANCE: Partial<Record<Claim["kind"], number>> = {
  "rest-point": 1e-6,
  "nash-equilibrium": 1e-6,
  ess: 1e-6,
  "final-state": 1e-4,
};

function flat(s: State): number[] {
  return (s as (number | number[])[]).flatMap((x) => (Array.isArray(x) ? x : [x]));
}

/** Max-norm distance between two states of the same shape; Infinity when the shapes differ. */
export function stateDistance(a: State, b: State): number {
  const x = flat(a);
  const y = flat(b);
  if (x.length !== y.length) return Number.POSITIVE_INFINITY;
  let d = 0;
  for (let i = 0; i < x.length; i++) d = Math.max(d, Math.abs((x[i] ?? 0) - (y[i] ?? 0)));
  return d;
}

function claimState(c: Claim): State | null {
  if (c.kind === "rest-point" || c.kind === "nash-equilibrium" || c.kind === "ess" || c.kind === "final-state") return c.state;
  return null;
}

/** Claims that speak about rest point `p` of the game at the spec's own parameters. */
function claimsAbout(p: RestPointReport, claims: readonly Claim[]): Claim[] {
  return claims.filter((c) => {
    if (c.parameters !== undefined && Object.keys(c.parameters).length > 0) return false;
    const s = claimState(c);
    if (s === null) return false;
    const tol = Math.max(c.tolerance ?? DEFAULT_TOLERANCE[c.kind] ?? 1e-6, 1e-9);
    return stateDistance(s, p.state) <= tol;
  });
}

function describe(p: RestPointReport): string {
  const traits = [p.stability.replace(/-/g, " ")];
  if (p.nash) traits.push("a Nash equilibrium");
  if (p.ess === true) traits.push("an ESS");
  const support = p.support.length === 0 ? "" : ` on ${p.support.join(", ")}`;
  return `${traits.join(", ")}${support}`;
}

function rank(p: RestPointReport): number {
  return (p.ess === true ? 0 : 2) + (p.stability === "asymptotically-stable" ? 0 : 1);
}

export function unclaimedFindings(spec: ModelSpec | null, report: Report): Finding[] {
  if (report.verdict === "invalid") return [];
  const claims: readonly Claim[] = spec?.claims ?? [];
  const out: Finding[] = [];
  const restPoints = [...(report.restPoints ?? [])].sort((a, b) => rank(a) - rank(b));
  for (const p of restPoints) {
    const about = claimsAbout(p, claims);
    if (about.length === 0) {
      out.push({ kind: "unclaimed-rest-point", restPoint: p, text: `No claim mentions this rest point (${describe(p)}).` });
      continue;
    }
    const withStability = about.some((c) => c.kind === "rest-point" && c.stability !== undefined);
    const restClaim = about.find((c) => c.kind === "rest-point");
    if (!withStability && restClaim !== undefined) {
      out.push({
        kind: "stability-not-stated",
        restPoint: p,
        ref: restClaim.id,
        text: `Claim ${restClaim.id} places a rest point here without saying how stable it is; the engine finds it ${p.stability.replace(/-/g, " ")}.`,
      });
    }
  }
  if (report.restPoints !== undefined && report.restPoints.length > 0 && !claims.some((c) => c.kind === "rest-point-count")) {
    const n = report.restPoints.length;
    out.push({
      kind: "count-not-stated",
      text: `The engine found ${n} isolated rest point${n === 1 ? "" : "s"} of the replicator dynamics; no claim says how many there are.`,
    });
  }
  const used = new Set(claims.flatMap((c) => (c.kind === "final-state" || c.kind === "trajectory" ? [c.experiment] : [])));
  for (const e of spec?.experiments ?? []) {
    if (!used.has(e.id)) out.push({ kind: "experiment-unused", ref: e.id, text: `Experiment ${e.id} is run, but no claim refers to it.` });
  }
  return out;
}
