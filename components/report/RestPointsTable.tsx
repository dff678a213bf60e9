/** Every isolated rest point the engine found, with its support, linear stability and equilibrium tests. */
import type { GameSpec, RestPointReport } from "@/lib/engine/types";
import { ScrollRegion, STACK_BODY, STACK_CELL, STACK_HEAD, STACK_ROW_PAIRS, STACK_TABLE } from "./stacked-table";
import { formatEigenvalues, formatNumber, isBimatrixState, STABILITY_LABELS, stateLabels } from "./format";
import { Glyph } from "@/components/ui/Glyph";

export interface RestPointsTableProps {
  restPoints: readonly RestPointReport[];
  game?: GameSpec;
  /** Most rows drawn (default 60): a large game can have thousands of rest points, which would make the page tens of megabytes. */
  limit?: number;
}

export const REST_POINT_ROW_LIMIT = 60;

/**
 * The rows to draw when there are more than `limit`: ESSs first, then other Nash equilibria,
 * then asymptotically stable points, then the rest, shown in the report's own order.
 */
export function pickRestPoints(restPoints: readonly RestPointReport[], limit: number): RestPointReport[] {
  if (restPoints.length <= limit) return [...restPoints];
  const rank = (rp: RestPointReport) => (rp.ess === true ? 0 : rp.nash ? 1 : rp.stability === "asymptotically-stable" ? 2 : 3);
  const chosen = restPoints
    .map((rp, i) => ({ rp, i }))
    .sort((a, b) => rank(a.rp) - rank(b.rp) || a.i - b.i)
    .slice(0, Math.max(0, limit))
    .sort((a, b) => a.i - b.i);
  return chosen.map((c) => c.rp);
}

function YesNo({ value }: { value: boolean | null }) {
  if (value === null) {
    return <span className="text-ink-faint" title="ESS is defined for symmetric games only">n/a</span>;
  }
  return value ? (
    <span className="inline-flex items-center gap-1">
      <svg viewBox="0 0 12 12" className="size-3" fill="none" stroke="currentColor" strokeWidth="1.8" aria-hidden="true">
        <path d="M2.5 6.3l2.2 2.2 4.8-5" />
      </svg>
      yes
    </span>
  ) : (
    <span className="inline-flex items-center gap-1 text-ink-faint">
      <svg viewBox="0 0 12 12" className="size-3" fill="none" stroke="currentColor" strokeWidth="1.8" aria-hidden="true">
        <path d="M3 6h6" />
      </svg>
      no
    </span>
  );
}

function StateCell({ state, game }: { state: RestPointReport["state"]; game?: GameSpec }) {
  const labels = stateLabels(game, state);
  const pops = isBimatrixState(state) ? state : [state];
  const popNames = game?.kind === "bimatrix" ? game.populations.map((p) => p.name) : ["x", "y"];
  return (
    <span className="font-mono text-xs tabular-nums">
      {pops.map((shares, p) => (
        <span key={p} className="block">
          {pops.length > 1 && <span className="text-ink-faint">{popNames[p]}: </span>}
          ({shares.map((x, i) => (
            <span key={i} title={`${labels[p]?.[i] ?? `s${i + 1}`} = ${x}`}>
              {i > 0 && ", "}
              {formatNumber(x)}
            </span>
          ))})
        </span>
      ))}
    </span>
  );
}

function StabilityWord({ stability }: { stability: RestPointReport["stability"] }) {
  const icon =
    stability === "asymptotically-stable" ? (
      // An arrow pointing in: trajectories approach.
      <path d="M2 6h6M6 3.5L8.5 6 6 8.5M10.5 2v8" />
    ) : stability === "unstable" ? (
      // An arrow pointing out: trajectories leave.
      <path d="M4 6h6M8 3.5L10.5 6 8 8.5M1.5 2v8" />
    ) : (
      // A level line: linearisation cannot decide.
      <path d="M1.5 6h9M1.5 3.5h9M1.5 8.5h9" strokeDasharray="1.5 1.5" />
    );
  return (
    <span className="inline-flex items-center gap-1.5 whitespace-nowrap">
      <svg viewBox="0 0 12 12" className="size-3.5" fill="none" stroke="currentColor" strokeWidth="1.5" aria-hidden="true">
        {icon}
      </svg>
      {STABILITY_LABELS[stability] ?? stability}
    </span>
  );
}

export function RestPointsTable({ restPoints: all, game, limit = REST_POINT_ROW_LIMIT }: RestPointsTableProps) {
  if (all.length === 0) {
    return <p className="text-sm text-ink-faint">The engine found no isolated rest point.</p>;
  }
  const restPoints = pickRestPoints(all, limit);
  const order =
    game?.kind === "symmetric"
      ? game.strategies.join(", ")
      : game?.kind === "bimatrix"
        ? game.populations.map((p) => `${p.name}: ${p.strategies.join(", ")}`).join("; ")
        : undefined;
  return (
    <>
      {/* The header row, which names the order of the shares, is hidden on a phone: say it once here. */}
      {restPoints.length < all.length && (
        <p className="mb-2 text-sm text-ink-soft" data-testid="rest-points-shown">
          Showing {restPoints.length} of {all.length} rest points (evolutionarily stable strategies, Nash equilibria and
          asymptotically stable points first); the report&apos;s JSON lists every one.
        </p>
      )}
      {order !== undefined && <p className="mb-1 text-xs text-ink-faint sm:hidden">States list the shares of {order}.</p>}
      <ScrollRegion label="Rest points">
        <table className={STACK_TABLE} data-testid="rest-points-table">
          <caption className="sr-only">Rest points of the replicator dynamics</caption>
          <thead className={STACK_HEAD}>
            <tr className="border-b border-line-strong text-xs uppercase tracking-wide text-ink-faint">
              <th scope="col" className="py-2 pr-4 font-semibold">
                State
                {order !== undefined && (
                  <span className="block font-normal normal-case tracking-normal">({order})</span>
                )}
              </th>
              <th scope="col" className="py-2 pr-4 font-semibold">Support</th>
              <th scope="col" className="py-2 pr-4 font-semibold">Stability</th>
              <th scope="col" className="py-2 pr-4 font-semibold">Eigenvalues</th>
              <th scope="col" className="py-2 pr-4 font-semibold">Nash</th>
              <th scope="col" className="py-2 font-semibold">ESS</th>
            </tr>
          </thead>
          <tbody className={STACK_BODY}>
            {restPoints.map((rp, i) => (
              <tr key={i} className={STACK_ROW_PAIRS}>
                <td className={`py-2 pr-4 max-sm:col-span-2 ${STACK_CELL}`} data-label="State">
                  <StateCell state={rp.state} game={game} />
                </td>
                <td className={`py-2 pr-4 max-sm:col-span-2 ${STACK_CELL}`} data-label="Support">
                  {rp.support.join(", ")}
                </td>
                <td className={`py-2 pr-4 max-sm:col-span-2 ${STACK_CELL}`} data-label="Stability">
                  <StabilityWord stability={rp.stability} />
                </td>
                <td className={`py-2 pr-4 font-mono text-xs tabular-nums max-sm:col-span-2 ${STACK_CELL}`} data-label="Eigenvalues">
                  {rp.eigenvalues.length === 0 ? (
                    <span className="text-ink-faint">
                      <Glyph char="—" label="none" />
                    </span>
                  ) : (
                    formatEigenvalues(rp.eigenvalues).map((e, j) => (
                      <span key={j} className="block whitespace-nowrap max-sm:ml-0 max-sm:inline max-sm:after:content-['_·_'] max-sm:last:after:content-none">
                        {e}
                      </span>
                    ))
                  )}
                </td>
                <td className={`py-2 pr-4 ${STACK_CELL}`} data-label="Nash">
                  <YesNo value={rp.nash} />
                </td>
                <td className={`py-2 ${STACK_CELL}`} data-label="ESS">
                  <YesNo value={rp.ess} />
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </ScrollRegion>
    </>
  );
}
