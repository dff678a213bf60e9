/** The legend beside a plot, as HTML text so it wraps and reads well at any width. */

import type { ReactNode } from "react";
import type { LegendEntry } from "@/lib/plots/export-svg";
import { seriesStyle } from "@/lib/plots/style";
import { markerPath } from "@/lib/plots/symbols";
import { PointMark, SURFACE } from "./svg-parts";

function Swatch({ entry }: { entry: Exclude<LegendEntry, { kind: "heading" }> }): ReactNode {
  if (entry.kind === "series") {
    const s = seriesStyle(entry.index);
    return (
      <svg aria-hidden="true" width={32} height={14} viewBox="0 0 32 14" className="shrink-0">
        <line
          x1={2}
          x2={30}
          y1={7}
          y2={7}
          style={{ stroke: s.color }}
          strokeWidth={2}
          strokeDasharray={s.dash === "" ? undefined : s.dash}
        />
        <path d={markerPath(s.marker, 16, 7, 7)} style={{ fill: s.color, stroke: SURFACE }} strokeWidth={1} />
      </svg>
    );
  }
  return (
    <svg aria-hidden="true" width={32} height={16} viewBox="0 0 32 16" className="shrink-0">
      <PointMark kind={entry.symbol} at={[16, 8]} size={10} index={entry.index} />
    </svg>
  );
}

/** Groups of entries, split at headings (population names in a two-population time series). */
export function Legend({ entries, label }: { entries: readonly LegendEntry[]; label: string }): ReactNode {
  if (entries.length === 0) return null;
  const groups: { heading: string | null; items: Exclude<LegendEntry, { kind: "heading" }>[] }[] = [];
  for (const entry of entries) {
    if (entry.kind === "heading") groups.push({ heading: entry.label, items: [] });
    else {
      const last = groups[groups.length - 1];
      if (last === undefined) groups.push({ heading: null, items: [entry] });
      else last.items.push(entry);
    }
  }
  return (
    <div className="mt-2 space-y-1 text-sm" aria-label={label} role="group">
      {groups.map((g, gi) => (
        <div key={gi}>
          {g.heading === null ? null : <p className="font-semibold">{g.heading}</p>}
          <ul className="flex flex-wrap gap-x-4 gap-y-1">
            {g.items.map((item, ii) => (
              <li key={ii} className="flex min-w-0 items-center gap-1.5">
                <Swatch entry={item} />
                <span className="break-words">{item.label}</span>
              </li>
            ))}
          </ul>
        </div>
      ))}
    </div>
  );
}
