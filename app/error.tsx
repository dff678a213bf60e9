"use client";
import { useEffect } from "react";
import { Button } from "@/components/ui/Button";

export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  useEffect(() => {
    console.error(error);
  }, [error]);
  return (
    <div className="mx-auto flex w-full max-w-md flex-col items-start gap-4 py-6" data-testid="status-500">
      <p className="font-mono text-sm text-ochre">Error</p>
      <h1 className="text-2xl font-bold">Something went wrong on our side</h1>
      <p className="text-ink-soft">The error was logged. Try again; if it keeps happening, tell the registry&apos;s administrators{error.digest === undefined ? "" : ` and quote ${error.digest}`}.</p>
      <Button onClick={reset}>Try again</Button>
    </div>
  );
}
