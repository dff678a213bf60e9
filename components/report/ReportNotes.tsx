/** The engine's own account of what it checked and how; always says what a confirmation is not. */

export const NOT_A_REVIEW =
  "A confirmed claim means the engine reproduced the number from the specification; it is not a peer review of the model or of its interpretation.";

export function ReportNotes({ notes }: { notes: readonly string[] | undefined }) {
  const list = [...(notes ?? [])];
  // The engine says this itself; add it only where an older report lacks the sentence.
  if (!list.some((n) => /peer review/i.test(n))) list.push(NOT_A_REVIEW);
  return (
    <section aria-labelledby="report-notes-heading" data-testid="report-notes">
      <h3 id="report-notes-heading" className="mb-2 text-base font-semibold">
        What was checked and how
      </h3>
      <ul className="list-disc space-y-1 pl-5 text-sm text-ink-soft">
        {list.map((n, i) => (
          <li key={i}>{n}</li>
        ))}
      </ul>
    </section>
  );
}
