"use client";
import { Button } from "@/components/ui/Button";
import { Notice } from "@/components/ui/Notice";

export default function AdminError({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div className="flex flex-col items-start gap-4">
      <Notice tone="error" title="This administration page could not be loaded.">
        The error was logged{error.digest === undefined ? "" : ` (${error.digest})`}. Your data is unchanged.
      </Notice>
      <Button kind="secondary" onClick={reset}>
        Try again
      </Button>
    </div>
  );
}
