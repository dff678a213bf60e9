/** One row per claim: what was claimed, the engine's status, how far off it was and why. */
import type { Claim, ClaimResult } from "@/lib/engine/types";
import { claimKindLabel } from "./format";
import { Sci } from "./Sci";
import { StatusMark } from "./StatusMark";

export interface ClaimsTableProps {
  claims: readonly ClaimResult[];
  /** The spec's own claims, for the author's notes beside each row (matched by id). */
  specClaims?: readonly Claim[];
  caption?: string;
}

export function ClaimsTable({ claims, specClaims, caption = "Claims" }: ClaimsTableProps) {
  const notes = new Map((specClaims ?? []).map((c) => [c.id, c.note]));
  if (claims.length === 0) {
    return <p className="text-sm text-ink-faint">No claim was checked.</p>;
  }
  return (
    <div className="overflow-x-auto">
      <table className="w-full border-collapse text-left text-sm" data-testid="claims-table">
        <caption className="sr-only">{caption}</caption>
        <thead>
          <tr className="border-b border-line-strong text-xs uppercase tracking-wide text-ink-faint">
            <th scope="col" className="py-2 pr-4 font-semibold">Claim</th>
            <th scope="col" className="py-2 pr-4 font-semibold">Kind</th>
            <th scope="col" className="py-2 pr-4 font-semibold">Status</th>
            <th scope="col" className="py-2 pr-4 font-semibold">Deviation</th>
            <th scope="col" className="py-2 font-semibold">What the engine found</th>
          </tr>
        </thead>
        <tbody>
          {claims.map((c) => {
            const note = notes.get(c.id);
            return (
              <tr
                key={c.id}
                id={`claim-${c.id}`}
                data-status={c.status}
                className="border-b border-line align-top last:border-0"
              >
                <th scope="row" className="min-w-[9rem] py-2 pr-4 font-mono text-xs font-normal break-words">
                  {c.id}
                </th>
                <td className="py-2 pr-4 whitespace-nowrap">{claimKindLabel(c.kind)}</td>
                <td className="py-2 pr-4 whitespace-nowrap">
                  <StatusMark outcome={c.status} />
                </td>
                <td className="py-2 pr-4 whitespace-nowrap">
                  {c.deviation === undefined ? (
                    <span className="text-ink-faint" aria-label="no deviation">—</span>
                  ) : (
                    <Sci value={c.deviation} />
                  )}
                  {c.tolerance !== undefined && (
                    <span className="block text-xs text-ink-faint">
                      tolerance <Sci value={c.tolerance} digits={1} />
                    </span>
                  )}
                </td>
                <td className="py-2">
                  <span>{c.message}</span>
                  {note !== undefined && note !== "" && (
                    <span className="mt-1 block text-xs text-ink-faint italic">
                      Author&rsquo;s note: {note}
                    </span>
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
