/** A quiet placeholder while a server page loads: a pulsing outline of its blocks. */
export function LoadingBlocks({ label = "Loading" }: { label?: string }) {
  return (
    <div className="flex flex-col gap-6" role="status" aria-live="polite">
      <span className="sr-only">{label}…</span>
      <div className="h-9 w-2/3 animate-pulse rounded bg-sunken" />
      <div className="h-4 w-1/2 animate-pulse rounded bg-sunken" />
      <div className="grid gap-4 sm:grid-cols-2">
        <div className="h-28 animate-pulse rounded-[var(--radius-card)] bg-sunken" />
        <div className="h-28 animate-pulse rounded-[var(--radius-card)] bg-sunken" />
      </div>
    </div>
  );
}
