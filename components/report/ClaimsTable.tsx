/** One row per claim: what was claimed, the engine's status, how far off it was and why. */
import type { Claim, ClaimResult } from "@/lib/engine/types";
import { claimKindLabel } from "./format";
import { Sci } from "./Sci";
import { StatusMark } from "./StatusMark";
import { ScrollRegion, STACK_BODY, STACK_CELL, STACK_HEAD, STACK_ROW, STACK_TABLE } from "./stacked-table";
import { Glyph } from "@/components/ui/Glyph";

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
    <ScrollRegion label={caption}>
      <table className={STACK_TABLE} data-testid="claims-table">
        <caption className="sr-only">{caption}</caption>
        <thead className={STACK_HEAD}>
          <tr className="border-b border-line-strong text-xs uppercase tracking-wide text-ink-faint">
            <th scope="col" className="py-2 pr-4 font-semibold">Claim</th>
            <th scope="col" className="py-2 pr-4 font-semibold">Status</th>
            <th scope="col" className="py-2 pr-4 font-semibold">Deviation</th>
            <th scope="col" className="py-2 font-semibold">What the engine found</th>
          </tr>
        </thead>
        <tbody className={STACK_BODY}>
          {claims.map((c) => {
            const note = notes.get(c.id);
            return (
              <tr key={c.id} id={`claim-${c.id}`} data-status={c.status} className={STACK_ROW}>
                {/* On a phone the card opens with the status, then says which claim it is. */}
                {/* The kind goes under the id rather than in a column of its own, leaving the sentence its width. */}
                <th scope="row" className={`min-w-[9rem] py-2 pr-4 font-normal max-sm:order-2 max-sm:min-w-0 ${STACK_CELL}`} data-label="Claim">
                  <span className="font-mono text-xs break-words">{c.id}</span>
                  <span className="block text-xs text-ink-soft max-sm:ml-2 max-sm:inline">{claimKindLabel(c.kind)}</span>
                </th>
                <td className={`py-2 pr-4 whitespace-nowrap max-sm:order-1 ${STACK_CELL}`} data-label="Status">
                  <StatusMark outcome={c.status} />
                </td>
                <td className={`py-2 pr-4 whitespace-nowrap max-sm:order-3 ${STACK_CELL}`} data-label="Deviation">
                  {c.deviation === undefined ? (
                    <span className="text-ink-faint">
                      <Glyph char="—" label="no deviation" />
                    </span>
                  ) : (
                    <Sci value={c.deviation} />
                  )}
                  {c.tolerance !== undefined && (
                    <span className="block text-xs text-ink-faint max-sm:ml-2 max-sm:inline">
                      tolerance <Sci value={c.tolerance} digits={1} />
                    </span>
                  )}
                </td>
                {/* A reading width for the sentence, so it is never squeezed into a tall column. */}
                <td className={`min-w-[18rem] py-2 max-sm:order-4 max-sm:min-w-0 max-sm:before:hidden ${STACK_CELL}`} data-label="What the engine found">
                  <span>{c.message}</span>
                  {note !== undefined && note !== "" && (
                    <span className="mt-1 block text-xs text-ink-faint italic">
                      Author&apos;s note: {note}
                    </span>
                  )}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </ScrollRegion>
  );
}
