/**
 * Tables that stay readable on a phone. From the `sm` breakpoint up they are ordinary tables
 * in a horizontally scrollable region that the keyboard can reach; below it each row becomes a
 * card, its cells stacked one per line with the column's name before the value (the header
 * row stays for screen readers). One markup for both, so nothing is rendered twice.
 */
import type { ReactNode } from "react";

/** The table element: a block of cards on narrow screens. */
export const STACK_TABLE = "w-full border-collapse text-left text-sm max-sm:block";
/** The header row: read by screen readers only on narrow screens. */
export const STACK_HEAD = "max-sm:sr-only";
export const STACK_BODY = "max-sm:block";
/** One row: a card on narrow screens (cells in a column, reorderable with `order-*`). */
export const STACK_ROW = "border-b border-line align-top last:border-0 max-sm:flex max-sm:flex-col max-sm:gap-1.5 max-sm:py-3";
/** A row as a two-column card on narrow screens, pairing short values (give the others `max-sm:col-span-2`). */
export const STACK_ROW_PAIRS = "border-b border-line align-top last:border-0 max-sm:grid max-sm:grid-cols-2 max-sm:gap-x-4 max-sm:gap-y-1.5 max-sm:py-3";
/**
 * One cell: on narrow screens a line of its own, led by its column's name from `data-label`
 * (so give every cell that attribute; the label is `.rp-stack-cell::before` in app/globals.css,
 * and `max-sm:before:hidden` drops it).
 */
export const STACK_CELL = "rp-stack-cell max-sm:block max-sm:p-0";

/**
 * A wide table's container: scrolls sideways when the table is wider than the screen, and is a
 * named, focusable region so keyboard users can scroll it too.
 */
export function ScrollRegion({ label, children }: { label: string; children: ReactNode }) {
  return (
    // Focusable because a region that scrolls must be scrollable from the keyboard (the global focus ring shows it).
    <div role="region" aria-label={label} tabIndex={0} className="overflow-x-auto">
      {children}
    </div>
  );
}
