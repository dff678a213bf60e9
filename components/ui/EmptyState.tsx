import type { ReactNode } from "react";

/** What a list shows when there is nothing in it yet: a sentence and the way to change that. */
export function EmptyState({ title, children, action }: { title: string; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="flex flex-col items-start gap-3 rounded-[var(--radius-card)] border border-dashed border-line-strong bg-sunken/50 px-6 py-8">
      <p className="text-base font-semibold text-ink">{title}</p>
      {children === undefined ? null : <div className="max-w-2xl text-sm text-ink-soft">{children}</div>}
      {action}
    </div>
  );
}
