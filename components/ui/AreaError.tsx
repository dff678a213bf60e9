"use client";
import { Button } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";

/** The body of an area's error boundary (error.tsx): what failed, the log reference, a retry. */
export function AreaError({ title, error, reset }: { title: string; error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div className="flex flex-col items-start gap-4">
      <Notice tone="error" title={title}>
        The error was logged{error.digest === undefined ? "" : ` (${error.digest})`}. Your data is unchanged.
      </Notice>
      <Button kind="secondary" onClick={reset}>
        Try again
      </Button>
    </div>
  );
}
